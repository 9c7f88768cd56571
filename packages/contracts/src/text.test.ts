import { describe, expect, it } from 'vitest';
import { designs } from '@benchwright/pricing';
import { AcceptEstimateBody, CommentBody, CreateProjectBody, EstimateLineInput, SignUpBody } from './index';

const signUp = (name: string) => SignUpBody.safeParse({ email: 'a@example.com', password: 'a-long-password', name });
const line = (description: string) =>
  EstimateLineInput.safeParse({ group: 'labour', description, quantity: 1, unit: 'h', unitPriceCents: 100 });

describe('text fields', () => {
  it('refuses NUL, line breaks, other C0/C1 controls and bidi overrides in names', () => {
    for (const bad of [
      'Ann\nLee',
      'Ann\u0000',
      'Ann\rLee',
      'Ann\u0085',
      '\u202Eeil\u202C',
      'A\u2066b\u2069',
      'Ann\u2028Lee',
    ])
      expect(signUp(bad).success, JSON.stringify(bad)).toBe(false);
    const r = signUp('Ann\u202ELee');
    expect(r.error?.issues[0]).toMatchObject({ path: ['name'], message: expect.stringMatching(/one line/) });
    expect(signUp('  Zoë Ødegård-Nakamura  ').data?.name).toBe('Zoë Ødegård-Nakamura');
    expect(signUp('محمد علي').success).toBe(true);
  });
  it('lets notes and comments keep line breaks (carriage returns become line feeds) but no other control', () => {
    const items = [{ spec: designs.bookcase.defaults, quantity: 1 }];
    expect(CreateProjectBody.parse({ items, notes: 'First\r\nSecond\n' }).notes).toBe('First\nSecond');
    expect(CreateProjectBody.safeParse({ items, notes: 'tab\there' }).success).toBe(false);
    expect(CreateProjectBody.safeParse({ items, notes: 'nul\u0000' }).success).toBe(false);
    expect(CreateProjectBody.safeParse({ items, notes: 'flip \u202Etxt.exe' }).success).toBe(false);
    expect(CommentBody.parse({ message: 'a\nb' }).message).toBe('a\nb');
    expect(CommentBody.safeParse({ message: 'a\u001Bb' }).success).toBe(false);
  });
  it('refuses controls in estimate lines and the accepting name', () => {
    expect(line('Sanding and finish').success).toBe(true);
    expect(line('Sanding\nfinish').success).toBe(false);
    expect(line('Sand\u202Eing').success).toBe(false);
    expect(AcceptEstimateBody.safeParse({ acceptedName: 'Priya\u0000Natarajan' }).success).toBe(false);
  });
});
