import { designs } from '@benchwright/pricing/geometry';
import { describe, expect, it } from 'vitest';
import { CreateProjectBody, MAX_PIECES, QuotePreviewBody, SignUpBody } from './index';

describe('SignUpBody', () => {
  it('trims and lower-cases the e-mail', () => {
    expect(SignUpBody.parse({ email: '  Priya@Example.COM ', password: 'a-long-password', name: ' Priya ' })).toEqual({
      email: 'priya@example.com',
      password: 'a-long-password',
      name: 'Priya',
    });
  });
  it('refuses a password under 10 characters', () => {
    const r = SignUpBody.safeParse({ email: 'a@example.com', password: 'short', name: 'A' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]).toMatchObject({ path: ['password'], message: 'use at least 10 characters' });
  });
});

describe('CreateProjectBody', () => {
  it('checks each item against its design, naming the path', () => {
    const r = CreateProjectBody.safeParse({
      items: [{ spec: { ...designs['wall-cabinet'].defaults, depthMm: 50 }, quantity: 2 }],
    });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]).toMatchObject({
      path: ['items', 0, 'spec', 'depthMm'],
      message: '50 mm is below the 229 mm minimum.',
    });
  });
  it(`caps a request at ${MAX_PIECES} pieces, the sum of the quantities`, () => {
    const spec = designs.bookcase.defaults;
    const ok = {
      items: [
        { spec, quantity: 20 },
        { spec, quantity: 20 },
      ],
    };
    expect(CreateProjectBody.safeParse(ok).success).toBe(true);
    expect(QuotePreviewBody.safeParse(ok).success).toBe(true);
    for (const schema of [CreateProjectBody, QuotePreviewBody]) {
      const r = schema.safeParse({
        items: [
          { spec, quantity: 20 },
          { spec, quantity: 21 },
        ],
      });
      expect(r.error?.issues).toEqual([
        expect.objectContaining({
          path: ['items'],
          message: 'at most 40 pieces in one request; these items add up to 41',
        }),
      ]);
    }
  });
  it('defaults the notes to empty', () => {
    expect(CreateProjectBody.parse({ items: [{ spec: designs.bookcase.defaults, quantity: 1 }] }).notes).toBe('');
  });
});
