/**
 * The server start as `npm start` does it: without SMTP_URL the local SMTP fake runs and the watch
 * scheduler sends to it; shutdown stops the scheduler, the fake and the database connection.
 */
import { describe, expect, inject, it } from 'vitest';
import nodemailer from 'nodemailer';
import { watchSchedulerOf } from '../../server/app';
import { ConfigError, loadConfig } from '../../server/config';
import { startServer } from '../../server/index';
import { OutboxMessageModel } from '../../server/models/outbox-message';
import { TEST_JWT_SECRET } from './helpers';

const env = { NODE_ENV: 'test', PORT: '0', BCRYPT_ROUNDS: '4', SMTP_FAKE_PORT: '0', WATCHES_ENABLED: 'true' };

describe('startServer with the SMTP fake', () => {
  it('starts the fake on 127.0.0.1 when SMTP_URL is unset, runs the scheduler, and stops everything on close', async () => {
    const running = await startServer({ config: loadConfig(env), databaseUrl: inject('databaseUrl'), jwtSecret: TEST_JWT_SECRET, smtpFake: true });
    try {
      expect(running.smtpFake).toBeDefined();
      expect(running.config.smtpUrl).toBe(`smtp://127.0.0.1:${running.smtpFake!.port}`);
      const transport = nodemailer.createTransport({ url: running.config.smtpUrl });
      await transport.sendMail({ from: 'a@example.test', to: 'b@example.test', subject: 'Through the running fake', text: 'x' });
      transport.close();
      expect(await OutboxMessageModel.count({ where: { subject: 'Through the running fake' } })).toBe(1);
      const health = await fetch(`${running.url}/api/health`);
      expect(health.status).toBe(200);
    } finally {
      await running.close();
    }
    // Closed: the fake no longer accepts connections.
    const transport = nodemailer.createTransport({ url: running.config.smtpUrl, connectionTimeout: 2000 });
    await expect(transport.sendMail({ from: 'a@example.test', to: 'b@example.test', subject: 'After close', text: 'x' })).rejects.toThrow();
  }, 60_000);

  it('uses SMTP_URL when it is set (no fake); the scheduler runs, and stops on close', async () => {
    const running = await startServer({
      config: loadConfig({ ...env, SMTP_URL: 'smtp://127.0.0.1:9' }), databaseUrl: inject('databaseUrl'), jwtSecret: TEST_JWT_SECRET, smtpFake: true,
    });
    try {
      expect(running.smtpFake).toBeUndefined();
      expect(running.config.smtpUrl).toBe('smtp://127.0.0.1:9');
      const scheduler = watchSchedulerOf(running.app);
      expect(scheduler.running).toBe(true);
    } finally {
      await running.close();
    }
    expect(watchSchedulerOf(running.app).running).toBe(false);
  }, 60_000);
});

describe('watch and mail settings', () => {
  it('has defaults: the app address for links, a From address, the fake on 2525, a scan every 5 minutes, watches on outside tests', () => {
    const c = loadConfig({});
    expect(c).toMatchObject({
      smtpUrl: undefined, appUrl: 'http://127.0.0.1:8080', mailFrom: 'Gnomon watches <watches@gnomon.localhost>',
      smtpFakePort: 2525, watchScanIntervalSeconds: 300, watchesEnabled: true,
    });
    expect(loadConfig({ NODE_ENV: 'test' }).watchesEnabled).toBe(false);
    expect(loadConfig({ NODE_ENV: 'test', WATCHES_ENABLED: '1' }).watchesEnabled).toBe(true);
    expect(loadConfig({ APP_URL: 'https://gnomon.example.org/' }).appUrl).toBe('https://gnomon.example.org');
  });

  it.each([
    ['SMTP_URL', 'http://mail.example.org'],
    ['SMTP_URL', 'not a url'],
    ['MAIL_FROM', 'nobody'],
    ['APP_URL', 'ftp://gnomon.example.org'],
    ['SMTP_FAKE_PORT', '70000'],
    ['WATCH_SCAN_INTERVAL_SECONDS', '1'],
    ['WATCHES_ENABLED', 'perhaps'],
  ])('refuses %s=%s with a line naming the variable', (key, value) => {
    expect(() => loadConfig({ [key]: value })).toThrow(ConfigError);
    expect(() => loadConfig({ [key]: value })).toThrow(new RegExp(`\\n  ${key}: `));
  });
});
