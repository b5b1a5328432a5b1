import { describe, expect, it } from 'vitest';
import { configWarnings, loadConfig } from './config';

const base = { DATABASE_URL: 'postgres://postgres@127.0.0.1:5432/x' };

describe('configuration warnings', () => {
  it('warns that sign-in cannot work with an https PUBLIC_URL and no TRUST_PROXY', () => {
    const warnings = configWarnings(loadConfig({ ...base, PUBLIC_URL: 'https://garden.example.org' }));
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toContain('set TRUST_PROXY=true');
  });

  it('is quiet behind a trusted proxy and on plain http', () => {
    expect(configWarnings(loadConfig({ ...base, PUBLIC_URL: 'https://garden.example.org', TRUST_PROXY: 'true' }))).toEqual([]);
    expect(configWarnings(loadConfig({ ...base, PUBLIC_URL: 'http://127.0.0.1:3000' }))).toEqual([]);
  });
});
