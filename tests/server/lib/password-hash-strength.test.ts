import { afterEach, describe, expect, it, vi } from 'vitest';
import argon2 from 'argon2';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { loadEnv, readPasswordHashStrength } from '../../../server/env';

const dataDir = () => fs.mkdtempSync(path.join(os.tmpdir(), 'cw-env-'));

/** A fresh copy of the hashing module, which reads the setting on first use. */
async function passwordsWith(strength: string | undefined) {
  vi.resetModules();
  vi.stubEnv('PASSWORD_HASH_STRENGTH', strength);
  return import('../../../server/lib/passwords');
}

afterEach(() => {
  vi.unstubAllEnvs();
  vi.resetModules();
});

describe('PASSWORD_HASH_STRENGTH', () => {
  it.each(['production', 'development', undefined])(
    'refuses "test" under NODE_ENV=%j, naming the setting',
    (nodeEnv) => {
      const source = { NODE_ENV: nodeEnv, PASSWORD_HASH_STRENGTH: 'test', DATA_DIR: dataDir() };
      expect(() => readPasswordHashStrength(source)).toThrow(/PASSWORD_HASH_STRENGTH/);
      expect(() => loadEnv({ ...source, JWT_SECRET: 'x'.repeat(32) })).toThrow(
        /PASSWORD_HASH_STRENGTH/,
      );
    },
  );

  it('accepts "test" under NODE_ENV=test and defaults to standard everywhere', () => {
    expect(readPasswordHashStrength({ NODE_ENV: 'test', PASSWORD_HASH_STRENGTH: 'test' })).toBe(
      'test',
    );
    expect(readPasswordHashStrength({ NODE_ENV: 'production' })).toBe('standard');
    expect(loadEnv({ NODE_ENV: 'development', DATA_DIR: dataDir() }).PASSWORD_HASH_STRENGTH).toBe(
      'standard',
    );
  });

  it('refuses an unknown strength', () => {
    expect(() =>
      readPasswordHashStrength({ NODE_ENV: 'test', PASSWORD_HASH_STRENGTH: 'weak' }),
    ).toThrow(/PASSWORD_HASH_STRENGTH/);
  });

  // Parameters per the OWASP Password Storage Cheat Sheet's Argon2id minimum (19 MiB, t=2, p=1),
  // read back from the PHC string the hash carries (RFC 9106 / PHC string format).
  it('hashes at the standard Argon2id cost by default', async () => {
    const { hashPassword, verifyPassword } = await passwordsWith(undefined);
    const hash = await hashPassword('correct horse battery staple');
    expect(hash).toMatch(/^\$argon2id\$v=19\$m=19456,p=1,t=2\$/);
    expect(await verifyPassword(hash, 'correct horse battery staple')).toEqual({
      ok: true,
      rehash: false,
    });
  });

  it('hashes made at test strength are real Argon2id hashes that verify and reject', async () => {
    const { hashPassword, verifyPassword } = await passwordsWith('test');
    const hash = await hashPassword('correct horse battery staple');
    expect(hash).toMatch(/^\$argon2id\$v=19\$m=8,p=1,t=1\$/);
    expect(await argon2.verify(hash, 'correct horse battery staple')).toBe(true);
    expect(await verifyPassword(hash, 'correct horse battery staple')).toEqual({
      ok: true,
      rehash: false,
    });
    expect((await verifyPassword(hash, 'wrong')).ok).toBe(false);
  });

  it('a test-strength hash is replaced at the next sign-in under the standard cost', async () => {
    const weak = await (await passwordsWith('test')).hashPassword('pw-0123456789');
    const { verifyPassword } = await passwordsWith(undefined);
    expect(await verifyPassword(weak, 'pw-0123456789')).toEqual({ ok: true, rehash: true });
  });
});
