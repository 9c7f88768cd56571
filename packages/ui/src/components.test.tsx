import { fireEvent, render, screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { CommentForm, Field, Money } from './components';

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

describe('CommentForm', () => {
  it('sends nothing while empty, sends what was written, and clears once sent', () => {
    const onSend = vi.fn((_m: string, done: () => void) => done());
    render(<CommentForm label="Write to the shop" pending={false} onSend={onSend} />);
    const box = screen.getByRole('textbox', { name: 'Write to the shop' });
    const send = screen.getByRole('button', { name: 'Send' });
    expect(send).toHaveProperty('disabled', true);
    fireEvent.change(box, { target: { value: 'Inset doors, please.' } });
    fireEvent.click(send);
    expect(onSend).toHaveBeenCalledWith('Inset doors, please.', expect.any(Function));
    expect(box).toHaveProperty('value', '');
  });
});
