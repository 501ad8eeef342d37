import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { apiErrorBodySchema } from '../../shared/errors';
import { userResponseSchema } from '../../shared/schemas/auth';
import { createTestApp, createTestContext, createUser, signedInAgent, uniqueEmail, TEST_PASSWORD, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => { ctx = await createTestContext(); });
afterAll(async () => { await ctx.db.close(); });

function expectErrorShape(body: unknown, code: string) {
  const parsed = apiErrorBodySchema.parse(body);
  expect(parsed.error.code).toBe(code);
  expect(JSON.stringify(body)).not.toMatch(/at \S+ \(|node_modules/); // no stack trace leaks
  return parsed.error;
}

describe('register', () => {
  it('creates a member account, signs it in with an httpOnly SameSite=Lax cookie and never returns the hash', async () => {
    const email = uniqueEmail('new');
    const res = await request(ctx.app).post('/api/auth/register').send({ name: 'Ada Fenwick', email, password: 'long-enough-pass' });
    expect(res.status).toBe(201);
    const { user } = userResponseSchema.parse(res.body);
    expect(user).toMatchObject({ name: 'Ada Fenwick', email, role: 'member', disabled: false });
    expect(JSON.stringify(res.body)).not.toContain('passwordHash');
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/gnomon_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/); // plain http in tests
  });

  it('stores the e-mail in lower case and refuses a second account with the same address in any case', async () => {
    const email = uniqueEmail('dup');
    const first = await request(ctx.app).post('/api/auth/register').send({ name: 'One', email: email.toUpperCase(), password: 'long-enough-pass' });
    expect(first.status).toBe(201);
    expect(first.body.user.email).toBe(email);
    const second = await request(ctx.app).post('/api/auth/register').send({ name: 'Two', email, password: 'long-enough-pass' });
    expect(second.status).toBe(409);
    expect(expectErrorShape(second.body, 'conflict').fields?.email).toMatch(/already exists/);
  });

  it.each([
    [{ name: 'X', email: 'not-an-email', password: 'long-enough-pass' }, 'email', /valid e-mail/],
    [{ name: 'X', email: 'ok@example.test', password: 'short' }, 'password', /at least 10/],
    [{ name: '', email: 'ok@example.test', password: 'long-enough-pass' }, 'name', /required/],
    [{ email: 'ok@example.test', password: 'long-enough-pass' }, 'name', /required/],
  ])('answers 400 with a message on the bad field for %j', async (body, field, message) => {
    const res = await request(ctx.app).post('/api/auth/register').send(body);
    expect(res.status).toBe(400);
    const error = expectErrorShape(res.body, 'validation');
    expect(error.fields?.[field]).toMatch(message);
  });

  it('answers 400 JSON for a body that is not JSON', async () => {
    const res = await request(ctx.app).post('/api/auth/register').set('Content-Type', 'application/json').send('{"name":');
    expect(res.status).toBe(400);
    expectErrorShape(res.body, 'validation');
  });

  it('answers 413 JSON for a body over the size limit', async () => {
    const res = await request(ctx.app).post('/api/auth/register').send({ name: 'x'.repeat(300_000), email: 'a@b.test', password: 'long-enough-pass' });
    expect(res.status).toBe(413);
    expectErrorShape(res.body, 'payload_too_large');
  });
});

describe('sign-in, current user and sign-out', () => {
  it('signs in, reports the current user, and signs out', async () => {
    const user = await createUser('member', 'Bea Lorne');
    const agent = await signedInAgent(ctx.app, user);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ id: user.id, name: 'Bea Lorne', role: 'member' });
    const out = await agent.post('/api/auth/logout');
    expect(out.status).toBe(204);
    expect(String(out.headers['set-cookie'])).toMatch(/gnomon_session=;/);
    const after = await agent.get('/api/auth/me');
    expect(after.status).toBe(401);
    expectErrorShape(after.body, 'unauthenticated');
  });

  it('gives one generic 401 message for a wrong password and for an unknown e-mail', async () => {
    const user = await createUser();
    const wrongPassword = await request(ctx.app).post('/api/auth/login').send({ email: user.email, password: 'not-the-password' });
    const unknownEmail = await request(ctx.app).post('/api/auth/login').send({ email: uniqueEmail('nobody'), password: TEST_PASSWORD });
    expect(wrongPassword.status).toBe(401);
    expect(unknownEmail.status).toBe(401);
    expect(expectErrorShape(wrongPassword.body, 'unauthenticated').message).toBe(expectErrorShape(unknownEmail.body, 'unauthenticated').message);
  });

  it('refuses a disabled account even with the right password', async () => {
    const user = await createUser();
    await user.update({ disabled: true });
    const res = await request(ctx.app).post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD });
    expect(res.status).toBe(403);
    expectErrorShape(res.body, 'forbidden');
  });

  it('refuses a forged or garbage session cookie', async () => {
    const res = await request(ctx.app).get('/api/auth/me').set('Cookie', 'gnomon_session=eyJhbGciOiJIUzI1NiJ9.e30.forged');
    expect(res.status).toBe(401);
  });

  it('stops a session working once its account is disabled', async () => {
    const user = await createUser();
    const agent = await signedInAgent(ctx.app, user);
    await user.update({ disabled: true });
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });
});

describe('repeated failed sign-ins', () => {
  it('are refused with 429 after the configured number of failures from one address', async () => {
    const limited = createTestApp(ctx.db, { LOGIN_MAX_FAILURES: '3', LOGIN_WINDOW_MINUTES: '1' });
    const user = await createUser();
    const statuses: number[] = [];
    for (let i = 0; i < 4; i += 1) {
      statuses.push((await request(limited.app).post('/api/auth/login').send({ email: user.email, password: 'wrong-password!' })).status);
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
    const blocked = await request(limited.app).post('/api/auth/login').send({ email: user.email, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expectErrorShape(blocked.body, 'rate_limited');
  });
});

describe('roles', () => {
  it.each([
    ['anonymous', 401],
    ['member', 403],
    ['admin', 200],
  ] as const)('GET /api/users as %s answers %i', async (who, status) => {
    const agent = who === 'anonymous' ? request.agent(ctx.app) : await signedInAgent(ctx.app, await createUser(who));
    const res = await agent.get('/api/users');
    expect(res.status).toBe(status);
    if (status === 200) expect(Array.isArray(res.body.users)).toBe(true);
    else expectErrorShape(res.body, who === 'anonymous' ? 'unauthenticated' : 'forbidden');
  });

  it('lets an admin promote a member and disable an account, but not demote themself', async () => {
    const admin = await createUser('admin');
    const member = await createUser('member');
    const agent = await signedInAgent(ctx.app, admin);
    const promoted = await agent.patch(`/api/users/${member.id}`).send({ role: 'admin' });
    expect(promoted.status).toBe(200);
    expect(promoted.body.user.role).toBe('admin');
    const disabled = await agent.patch(`/api/users/${member.id}`).send({ disabled: true });
    expect(disabled.body.user.disabled).toBe(true);
    const self = await agent.patch(`/api/users/${admin.id}`).send({ role: 'member' });
    expect(self.status).toBe(400);
    expectErrorShape(self.body, 'validation');
  });

  it('two admins demoting each other at the same moment leave one admin, never none', async () => {
    const a = await createUser('admin', 'Admin A');
    const b = await createUser('admin', 'Admin B');
    const [agentA, agentB] = [await signedInAgent(ctx.app, a), await signedInAgent(ctx.app, b)];
    const [byA, byB] = await Promise.all([
      agentA.patch(`/api/users/${b.id}`).send({ role: 'member' }),
      agentB.patch(`/api/users/${a.id}`).send({ role: 'member' }),
    ]);
    // One wins; the other finds it is no longer an admin (the session's role is read per request,
    // so it may also be refused before the service: 403 either way).
    expect([byA.status, byB.status].sort()).toEqual([200, 403]);
    await Promise.all([a.reload(), b.reload()]);
    expect([a.role, b.role].filter((r) => r === 'admin')).toHaveLength(1);
  });

  it('answers 400 for a bad role value and 404 for an unknown account', async () => {
    const agent = await signedInAgent(ctx.app, await createUser('admin'));
    const bad = await agent.patch(`/api/users/${(await createUser()).id}`).send({ role: 'overlord' });
    expect(bad.status).toBe(400);
    expect(expectErrorShape(bad.body, 'validation').fields?.role).toBeTruthy();
    const missing = await agent.patch('/api/users/00000000-0000-4000-8000-000000000000').send({ role: 'admin' });
    expect(missing.status).toBe(404);
    const notUuid = await agent.patch('/api/users/42').send({ role: 'admin' });
    expect(notUuid.status).toBe(400);
  });

  it('a member cannot change roles', async () => {
    const member = await createUser('member');
    const agent = await signedInAgent(ctx.app, member);
    const res = await agent.patch(`/api/users/${member.id}`).send({ role: 'admin' });
    expect(res.status).toBe(403);
  });
});

describe('unknown API routes and headers', () => {
  it('answers 404 JSON for an unknown /api route', async () => {
    const res = await request(ctx.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expectErrorShape(res.body, 'not_found');
  });

  it('sends helmet security headers and no x-powered-by', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['access-control-allow-origin']).toBeUndefined();
  });
});
