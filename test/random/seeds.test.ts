// Tests of src/random/seeds.ts: seed derivation by hashing.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { hashParts, replicationSeed } from '../../src/random/index.js';

describe('hashParts', () => {
  it('is SHA-256 of the JSON text of the parts', () => {
    // Expected digest computed outside the project: `printf '%s' '["jostle-pin",null,7]' | sha256sum`
    // (coreutils; SHA-256 as specified in FIPS 180-4).
    expect(hashParts(['jostle-pin', null, 7])).toBe('07ec209e51e4198c7a23d51c09ad09278832af5442a9f8117c0c43bf50c41b47');
  });

  it('gives 64 lowercase hex chars and separates look-alike part lists', () => {
    // exact: JSON quotes strings and delimits array elements, so these encodings differ.
    const digests = [hashParts(['a,b']), hashParts(['a', 'b']), hashParts([1]), hashParts(['1']),
      hashParts([null]), hashParts(['null']), hashParts([]), hashParts([1, 2]), hashParts([12])];
    for (const d of digests) expect(d).toMatch(/^[0-9a-f]{64}$/);
    expect(new Set(digests).size).toBe(digests.length);
  });

  it('rejects non-finite numbers (JSON would turn them into null)', () => {
    expect(() => hashParts([Number.NaN])).toThrow(RangeError);
    expect(() => hashParts([Infinity])).toThrow(RangeError);
  });
});

describe('replicationSeed', () => {
  it('is the first 16 hex chars of SHA-256 over [root, point, replication]', () => {
    // External: `printf '%s' '[12345,0,0]' | sha256sum` = 6b2f342a69650d06c494e9c1...
    expect(replicationSeed(12345, 0, 0)).toBe('6b2f342a69650d06');
  });

  it('is deterministic and 16 lowercase hex chars', () => {
    fc.assert(
      fc.property(fc.oneof(fc.integer(), fc.string()), fc.option(fc.nat()), fc.nat(), (root, point, rep) => {
        const a = replicationSeed(root, point, rep);
        expect(a).toMatch(/^[0-9a-f]{16}$/);
        expect(replicationSeed(root, point, rep)).toBe(a);
      }),
    );
  });

  it('differs when root, point or replication differs', () => {
    const base = replicationSeed(7, 3, 5);
    const others = [replicationSeed(8, 3, 5), replicationSeed('7', 3, 5), replicationSeed(7, 4, 5),
      replicationSeed(7, 3, 6), replicationSeed(7, null, 5)];
    for (const o of others) expect(o).not.toBe(base);
  });

  it('with point null (common random numbers) depends on root and replication only', () => {
    // One seed serves every point; it must differ from every numbered point's seed.
    const crn = replicationSeed('exp', null, 2);
    expect(crn).toBe(hashParts(['exp', null, 2]).slice(0, 16));
    for (let point = 0; point < 50; point++) expect(replicationSeed('exp', point, 2)).not.toBe(crn);
    expect(replicationSeed('exp', null, 3)).not.toBe(crn);
  });

  it('is not seed + i: roots 1 and 2 share no replication seeds', () => {
    // With additive seeding, replicationSeed(1, 0, r + 1) would equal replicationSeed(2, 0, r).
    expect(replicationSeed(1, 0, 1)).not.toBe(replicationSeed(2, 0, 0));
    const one = new Set<string>();
    for (let r = 0; r < 200; r++) one.add(replicationSeed(1, 0, r));
    for (let r = 0; r < 200; r++) expect(one.has(replicationSeed(2, 0, r))).toBe(false);
  });

  it('rejects malformed indices with RangeError', () => {
    expect(() => replicationSeed(1.5, 0, 0)).toThrow(RangeError);
    expect(() => replicationSeed(1, -1, 0)).toThrow(RangeError);
    expect(() => replicationSeed(1, 0.5, 0)).toThrow(RangeError);
    expect(() => replicationSeed(1, 0, -1)).toThrow(RangeError);
    expect(() => replicationSeed(1, 0, Number.NaN)).toThrow(RangeError);
  });
});
