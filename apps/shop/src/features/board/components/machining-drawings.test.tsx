import { render, screen, within } from '@testing-library/react';
import { demoPriceBook, demoSettings, designs, estimate, traveller } from '@benchwright/pricing';
import { describe, expect, it } from 'vitest';
import { MachiningPanel } from './machining-drawings';

// the traveller of two default base cabinets, as a revision keeps it
const t = traveller(
  estimate([{ spec: designs['base-cabinet'].defaults, quantity: 2 }], demoPriceBook, demoSettings, { effort: 'quick' }),
  demoPriceBook,
  demoSettings,
);

describe('the traveller’s machining drawings', () => {
  it('draws each machined part once with its count, size, piece and located notes, in inches', () => {
    render(<MachiningPanel pieces={t.pieces} units="in" />);
    expect(screen.getByRole('heading', { name: 'Machining' })).toBeTruthy();
    const side = screen.getByRole('figure', { name: 'Machining: side' });
    expect(side.textContent).toContain('side × 4');
    expect(side.textContent).toContain('34 1/2" x 24" x 23/32"');
    expect(side.textContent).toContain('Base cabinet');
    expect(
      within(side).getByText('Dado for the bottom, inside face: 23/32" wide, 1/4" deep, 4" from the bottom end.'),
    ).toBeTruthy();
    // drawn to scale in the part's millimetres: 28 shelf-pin holes, the dado's figure, the named ends
    const svg = within(side).getByRole('img', { name: 'side, 34 1/2" x 24" x 23/32"' });
    expect(svg.getAttribute('viewBox')).toMatch(/^-?[\d.]+ -?[\d.]+ [\d.]+ [\d.]+$/);
    expect(svg.querySelectorAll('circle').length).toBeGreaterThanOrEqual(28);
    expect([...svg.querySelectorAll('text')].map((x) => x.textContent)).toEqual(
      expect.arrayContaining(['4"', '27 1/16"', 'bottom end', 'front edge']),
    );
    const door = screen.getByRole('figure', { name: 'Machining: door' });
    expect(door.textContent).toContain('door × 2');
    expect(door.textContent).toContain('3 15/16" from the bottom end and 3 15/16" from the top end');
    // a part with neither machining nor banding is not drawn
    expect(screen.queryByRole('figure', { name: 'Machining: back' })).toBeNull();
    expect(screen.queryByRole('figure', { name: 'Machining: toe kick' })).toBeNull();
  });
  it('writes millimetres for a metric shop', () => {
    render(<MachiningPanel pieces={t.pieces} units="mm" />);
    const door = screen.getByRole('figure', { name: 'Machining: door' });
    expect(door.textContent).toContain('centers 22.5 mm from the hinge edge; 100 mm from the bottom end');
    expect([...door.querySelectorAll('svg text')].map((x) => x.textContent)).toContain('22.5 mm');
  });
  it('draws nothing for a job without machined or banded parts', () => {
    const { container } = render(<MachiningPanel pieces={[]} units="in" />);
    expect(container.textContent).toBe('');
  });
});
