import { describe, expect, it } from 'vitest';
import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import { loadEnv } from '../../server/env';

const dataDir = () => fs.mkdtempSync(path.join(os.tmpdir(), 'cw-env-'));

describe('loadEnv', () => {
  it('refuses to start in production without JWT_SECRET, naming the setting', () => {
    expect(() => loadEnv({ NODE_ENV: 'production', DATA_DIR: dataDir() })).toThrow(/JWT_SECRET/);
  });

  it('refuses a production secret shorter than 32 characters', () => {
    expect(() => loadEnv({ NODE_ENV: 'production', JWT_SECRET: 'short' })).toThrow(/JWT_SECRET/);
  });

  it('keeps generating a local secret outside production, the same one on every start', () => {
    const dir = dataDir();
    const first = loadEnv({ NODE_ENV: 'development', DATA_DIR: dir }).JWT_SECRET;
    expect(first.length).toBeGreaterThanOrEqual(32);
    expect(loadEnv({ NODE_ENV: 'development', DATA_DIR: dir }).JWT_SECRET).toBe(first);
  });

  it.each([
    ['loopback', 'loopback'],
    ['false', false],
    ['true', true],
    ['1', 1],
    ['10.0.0.0/8, fc00::/7', '10.0.0.0/8, fc00::/7'],
  ])('reads TRUST_PROXY=%j as %j', (raw, want) => {
    expect(loadEnv({ TRUST_PROXY: raw, DATA_DIR: dataDir() }).TRUST_PROXY).toEqual(want);
  });

  it('runs one web process unless WEB_INSTANCES says more', () => {
    expect(loadEnv({ DATA_DIR: dataDir() }).WEB_INSTANCES).toBe(1);
    expect(loadEnv({ WEB_INSTANCES: '2', DATA_DIR: dataDir() }).WEB_INSTANCES).toBe(2);
  });

  it.each(['0', '1.5', 'two'])('refuses WEB_INSTANCES=%j, naming the setting', (raw) => {
    expect(() => loadEnv({ WEB_INSTANCES: raw, DATA_DIR: dataDir() })).toThrow(/WEB_INSTANCES/);
  });

  it('yields the embedded mixed logit above 20 % event-loop utilisation unless told otherwise', () => {
    expect(loadEnv({ DATA_DIR: dataDir() }).ENGINE_YIELD_UTILISATION).toBe(0.2);
    expect(
      loadEnv({ ENGINE_YIELD_UTILISATION: '0', DATA_DIR: dataDir() }).ENGINE_YIELD_UTILISATION,
    ).toBe(0);
  });

  it.each(['-0.1', '1.5', 'half'])('refuses ENGINE_YIELD_UTILISATION=%j', (raw) => {
    expect(() => loadEnv({ ENGINE_YIELD_UTILISATION: raw, DATA_DIR: dataDir() })).toThrow(
      /ENGINE_YIELD_UTILISATION/,
    );
  });
});
