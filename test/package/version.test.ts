import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { VERSION } from '../../src/version.js';

describe('VERSION', () => {
  it('equals package.json\'s version (what --version prints)', () => {
    expect(VERSION).toBe(JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')).version);
  });
});
