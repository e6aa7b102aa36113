/**
 * Smoke test: every script in examples/ runs to completion, prints something, and prints no NaN.
 */
import { describe, it, expect, vi } from 'vitest';
import { readdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const dir = resolve(dirname(fileURLToPath(import.meta.url)), '../examples');
const files = readdirSync(dir).filter((f) => f.endsWith('.ts')).sort();

describe('examples', () => {
  it('there are examples', () => expect(files.length).toBeGreaterThan(0));
  for (const f of files) {
    it(`${f} runs`, async () => {
      const lines: string[] = [];
      const spy = vi.spyOn(console, 'log').mockImplementation((...a: unknown[]) => { lines.push(a.join(' ')); });
      try {
        await import(pathToFileURL(join(dir, f)).href);
      } finally {
        spy.mockRestore();
      }
      expect(lines.length).toBeGreaterThan(0);
      expect(lines.join('\n')).not.toMatch(/NaN/);
    });
  }
});
