import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../src/config/load-config.js';
import { ENV_DOCS, EnvSchema } from '../../src/config/env-schema.js';

describe('loadConfig', () => {
  it('gives the documented defaults when nothing is set', () => {
    const c = loadConfig({});
    expect(c.HOST).toBe('127.0.0.1');
    expect(c.PORT).toBe(8080);
    expect(c.LOOPGATE_API_KEYS).toEqual([]);
    expect(c.LOOPGATE_RATE_LIMIT_MAX).toBe(0);
    expect(c.LOOPGATE_CORS_ORIGINS).toEqual([]);
    expect(c.LOOPGATE_ANALYSIS_WORKERS).toBeGreaterThanOrEqual(1);
    expect(c.LOOPGATE_TRUST_PROXY).toBe(false);
  });

  it('parses lists, numbers and switches', () => {
    const c = loadConfig({
      PORT: '0',
      LOOPGATE_API_KEYS: ' pump-loop-key-0001 , pasteuriser-key-0002 ',
      LOOPGATE_CORS_ORIGINS: 'https://review.example.org,http://127.0.0.1:5173',
      LOOPGATE_RATE_LIMIT_MAX: '120',
      LOOPGATE_MAX_EVENT_LOOP_UTILIZATION: '0.9',
      LOOPGATE_TRUST_PROXY: 'true',
      UNRELATED: 'x',
    });
    expect(c.PORT).toBe(0);
    expect(c.LOOPGATE_API_KEYS).toEqual(['pump-loop-key-0001', 'pasteuriser-key-0002']);
    expect(c.LOOPGATE_CORS_ORIGINS).toEqual(['https://review.example.org', 'http://127.0.0.1:5173']);
    expect(c.LOOPGATE_RATE_LIMIT_MAX).toBe(120);
    expect(c.LOOPGATE_MAX_EVENT_LOOP_UTILIZATION).toBe(0.9);
    expect(c.LOOPGATE_TRUST_PROXY).toBe(true);
  });

  it('an empty string counts as unset', () => {
    expect(loadConfig({ PORT: '', LOOPGATE_API_KEYS: '' }).PORT).toBe(8080);
  });

  it.each([
    ['PORT', 'eighty'],
    ['PORT', '70000'],
    ['PORT', '-1'],
    ['LOG_LEVEL', 'loud'],
    ['LOOPGATE_RATE_LIMIT_WINDOW_MS', '10'],
    ['LOOPGATE_MAX_EVENT_LOOP_UTILIZATION', '1.5'],
    ['LOOPGATE_CORS_ORIGINS', 'review.example.org'],
    ['LOOPGATE_CORS_ORIGINS', 'https://review.example.org/path'],
    ['LOOPGATE_TRUST_PROXY', 'yes'],
    ['LOOPGATE_REQUEST_TIMEOUT_MS', '1.5'],
  ])('refuses %s=%s and names the variable', (name, value) => {
    expect(() => loadConfig({ [name]: value })).toThrow(ConfigError);
    try {
      loadConfig({ [name]: value });
    } catch (err) {
      expect((err as ConfigError).problems[0]).toContain(name);
    }
  });

  it('refuses a short API key without echoing it', () => {
    try {
      loadConfig({ LOOPGATE_API_KEYS: 'short-secret' });
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(ConfigError);
      expect((err as Error).message).toContain('LOOPGATE_API_KEYS');
      expect((err as Error).message).not.toContain('short-secret');
    }
  });

  it('documents every variable it reads', () => {
    expect(Object.keys(ENV_DOCS).sort()).toEqual(Object.keys(EnvSchema.shape).sort());
  });
});
