import { describe, expect, it } from 'vitest';
import { loadConfig } from './config';

const production = {
  NODE_ENV: 'production',
  RILLMARK_SESSION_SECRET: 'q7Yl0d9W3m8sVb2Kc5Nf1Xp6Rt4Hz0Ja',
  RILLMARK_SMTP_HOST: 'smtp.example.net',
  RILLMARK_SMTP_TLS: 'starttls',
  RILLMARK_SMTP_USER: 'rillmark',
  RILLMARK_SMTP_PASSWORD: 'smtp-secret',
};

describe('configuration refuses unsafe production settings', () => {
  it('when production settings are safe, then they load (outbox off, trust proxy off)', () => {
    const config = loadConfig(production);
    expect(config.mail).toMatchObject({ tls: 'starttls', devOutbox: false, auth: { user: 'rillmark' } });
    expect(config.http.trustProxy).toBe(false);
  });

  it('when production runs with the development session secret, then it is refused naming the variable', () => {
    const { RILLMARK_SESSION_SECRET: _, ...rest } = production;
    expect(() => loadConfig(rest)).toThrow(/RILLMARK_SESSION_SECRET: still the development value/);
  });

  it('when production turns the development outbox on, then it is refused (finding 2)', () => {
    expect(() => loadConfig({ ...production, RILLMARK_DEV_OUTBOX: 'true' })).toThrow(/RILLMARK_DEV_OUTBOX/);
  });

  it('when production would send mail or an SMTP password unencrypted to another host, then it is refused', () => {
    expect(() => loadConfig({ ...production, RILLMARK_SMTP_TLS: 'none' })).toThrow(
      /RILLMARK_SMTP_TLS: mail to smtp\.example\.net would go unencrypted[\s\S]*RILLMARK_SMTP_PASSWORD: would be sent in clear/,
    );
    // A relay on the same machine may take plain SMTP.
    expect(loadConfig({ ...production, RILLMARK_SMTP_HOST: '127.0.0.1', RILLMARK_SMTP_TLS: 'none' }).mail.tls).toBe(
      'none',
    );
  });

  it('when an SMTP user is given without a password, then it is refused in any environment', () => {
    expect(() => loadConfig({ RILLMARK_SMTP_USER: 'someone' })).toThrow(/set both or neither/);
  });

  it('when nothing is set, then the outbox is off and X-Forwarded-For is not trusted', () => {
    const config = loadConfig({});
    expect(config.mail.devOutbox).toBe(false);
    expect(config.http.trustProxy).toBe(false);
    expect(loadConfig({ RILLMARK_TRUST_PROXY: '1' }).http.trustProxy).toBe(1);
    expect(loadConfig({ RILLMARK_TRUST_PROXY: 'loopback, 10.0.0.0/8' }).http.trustProxy).toBe('loopback, 10.0.0.0/8');
  });
});
