import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { Field, Money } from './components';

describe('Field', () => {
  it('ties the label and the error to the input', () => {
    render(<Field label="E-mail" error="enter a valid e-mail address" defaultValue="nope" />);
    const input = screen.getByLabelText('E-mail');
    expect(input).toHaveProperty('value', 'nope');
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByRole('alert').textContent).toBe('enter a valid e-mail address');
  });
});

describe('Money', () => {
  it('writes cents as US dollars', () => {
    render(<Money cents={123450} />);
    expect(screen.getByText('$1,234.50')).toBeTruthy();
  });
});
