import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { newId } from './ids';

describe('event ids made on the tablet', () => {
  it('are RFC 9562 version 7 UUIDs (checked with zod’s UUID validator), made without crypto.randomUUID', () => {
    const saved = crypto.randomUUID;
    try {
      (crypto as { randomUUID?: unknown }).randomUUID = undefined;
      const ids = Array.from({ length: 200 }, newId);
      for (const id of ids) expect(z.uuid({ version: 'v7' }).safeParse(id).success, id).toBe(true);
      expect(new Set(ids).size).toBe(200);
    } finally {
      (crypto as { randomUUID?: unknown }).randomUUID = saved;
    }
  });
});
