import { describe, expect, it } from 'vitest';
import { safeRedirect } from './safe-redirect';

describe('safeRedirect', () => {
  it('returns a path of the app as it is', () => {
    expect(safeRedirect('/projects', '/home')).toBe('/projects');
    expect(safeRedirect('/projects/42?tab=estimate#pay', '/home')).toBe('/projects/42?tab=estimate#pay');
    expect(safeRedirect('/designs/bookcase', '/home')).toBe('/designs/bookcase');
  });
  it('returns the fallback for another site or anything that is not a path', () => {
    for (const bad of [
      '//evil.example',
      '//evil.example/projects',
      '/\\evil.example',
      '/\t/evil.example',
      '/\n/evil.example',
      '/x\\..\\..\\/evil',
      'https://evil.example/',
      'javascript:alert(1)',
      'projects',
      '',
      null,
      undefined,
    ])
      expect(safeRedirect(bad, '/home'), JSON.stringify(bad)).toBe('/home');
  });
});
