// Object.freeze semantics: ECMAScript 2024, 20.1.2.6 (Object.freeze) and strict-mode assignment to a
// non-writable property throws a TypeError (10.1.9 OrdinarySet) — from memory.
import { describe, expect, it } from 'vitest';
import { deepFreeze } from '../../src/config/deep-freeze.js';

describe('deepFreeze', () => {
  it('freezes nested objects and arrays and returns the same value', () => {
    const value = { a: { b: [1, { c: 2 }] }, d: 'x' };
    const frozen = deepFreeze(value);
    expect(frozen).toBe(value);
    expect(Object.isFrozen(value.a)).toBe(true);
    expect(Object.isFrozen(value.a.b)).toBe(true);
    expect(Object.isFrozen(value.a.b[1])).toBe(true);
    expect(() => {
      (value.a.b as unknown[]).push(3);
    }).toThrow(TypeError);
  });

  it('handles cycles, primitives and typed arrays', () => {
    const cyclic: { self?: unknown; data: Float64Array } = { data: new Float64Array(2) };
    cyclic.self = cyclic;
    deepFreeze(cyclic);
    expect(Object.isFrozen(cyclic)).toBe(true);
    expect(deepFreeze(5)).toBe(5);
    expect(deepFreeze(null)).toBeNull();
  });
});
