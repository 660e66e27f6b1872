import { count } from 'drizzle-orm';
import request from 'supertest';
import { refreshTokens } from '../../api/db/schema';
import { createTestApp, signIn, type TestApp } from './fixture';

interface ErrorBody {
  error: { code: string; message: string; fields?: { field: string; message: string }[] };
}

describe('bad input', () => {
  let t: TestApp;
  beforeAll(() => {
    t = createTestApp({ loginFailuresPerIp: 1000, loginFailuresPerAccount: 1000 });
  });
  afterAll(() => t.close());

  const tokenRows = () => t.db.select({ n: count() }).from(refreshTokens).get()?.n ?? 0;

  async function expect400(send: () => request.Test, field: string): Promise<ErrorBody> {
    const before = tokenRows();
    const res = await send();
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(400);
    const body = res.body as ErrorBody;
    expect(body.error.message).toBeTruthy();
    expect(body.error.fields?.map((f) => f.field)).toContain(field);
    expect(tokenRows()).withContext('nothing written').toBe(before);
    return body;
  }

  it('refuses malformed JSON naming the body', async () => {
    const body = await expect400(
      () => request(t.app).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": "a@b.test", "password": '),
      'body',
    );
    expect(body.error.code).toBe('invalid_json');
  });

  it('refuses missing fields naming each one', async () => {
    const body = await expect400(() => request(t.app).post('/api/auth/login').send({}), 'email');
    expect(body.error.fields?.map((f) => f.field)).toContain('password');
    expect(body.error.code).toBe('invalid');
  });

  it('refuses wrong types naming the field', async () => {
    await expect400(
      () => request(t.app).post('/api/auth/login').send({ email: 'head.coach@kestrel-vale.test', password: 12345 }),
      'password',
    );
    await expect400(
      () =>
        request(t.app)
          .post('/api/auth/login')
          .send({ email: ['x'], password: 'p' }),
      'email',
    );
    await expect400(() => request(t.app).post('/api/auth/login').send({ email: 'not-an-email', password: 'p' }), 'email');
    await expect400(() => request(t.app).post('/api/auth/refresh').send({ refreshToken: 42 }), 'refreshToken');
  });

  it('refuses a JSON value that is not an object', async () => {
    await expect400(() => request(t.app).post('/api/auth/login').set('Content-Type', 'application/json').send('[1,2,3]'), 'body');
  });

  it('refuses an oversized body with 413 naming the body', async () => {
    const huge = JSON.stringify({ email: 'a@b.test', password: 'x'.repeat(1_200_000) });
    const res = await request(t.app).post('/api/auth/login').set('Content-Type', 'application/json').send(huge);
    expect(res.status).toBe(413);
    const body = res.body as ErrorBody;
    expect(body.error.code).toBe('body_too_large');
    expect(body.error.fields?.[0].field).toBe('body');
  });

  it('refuses a bad query parameter naming it', async () => {
    const s = await signIn(t.app, 'head.coach@kestrel-vale.test');
    const res = await request(t.app).get('/api/players?squadId=not-a-uuid').set('Authorization', `Bearer ${s.accessToken}`);
    expect(res.status).toBe(400);
    expect((res.body as ErrorBody).error.fields?.[0].field).toBe('squadId');
  });
});
