import { describe, it, expect } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readTouchstoneFile, writeTouchstoneFile } from '../../src/network/node.js';
import { createMultiport } from '../../src/network/multiport.js';
import { ParseError } from '../../src/errors.js';
import { randomMatrix } from '../helpers/matchers.js';

describe('Touchstone files on disk', () => {
  it('writes and reads a version 1 .s3p (port count from the extension)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-net-'));
    try {
      const net = createMultiport('scattering', [1e9, 2e9], [randomMatrix(3, 3, 1), randomMatrix(3, 3, 2)]);
      const p = join(dir, 'three.s3p');
      writeTouchstoneFile(p, net, { version: 1 });
      const d = readTouchstoneFile(p);
      expect(d.network.ports).toBe(3);
      expect(Array.from(d.network.data)).toEqual(Array.from(net.data));
      writeFileSync(join(dir, 'bad.s1p'), '# GHz S RI\n1 0 x\n');
      expect(() => readTouchstoneFile(join(dir, 'bad.s1p'))).toThrow(ParseError);
      expect(() => readTouchstoneFile(join(dir, 'missing.s2p'))).toThrow(ParseError);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
