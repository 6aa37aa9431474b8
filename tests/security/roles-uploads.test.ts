/**
 * Item 5 of the hardening issue: upload history and previews (failed previews quote old
 * and new values and the uploader's address) are for staff only.
 */
import request from 'supertest';
import { signedInApp, type SignedInApp } from '../support/signed-in-app';
import { DEMO, signInAs } from '../support/auth';

jest.setTimeout(60_000);

let w: SignedInApp;
beforeAll(async () => {
  w = await signedInApp({ as: 'official' });
});
afterAll(() => w.close());

describe('upload history and previews', () => {
  it('refuse officials (403) and strangers (401), and answer analysts and admins', async () => {
    const analyst = (await signInAs(w.server, DEMO.analyst)).agent;
    const admin = (await signInAs(w.server, DEMO.admin)).agent;
    const list = await analyst.get('/api/uploads?limit=5');
    expect(list.status).toBe(200);
    const id = list.body.uploads[0].id;
    expect((await admin.get(`/api/uploads/${id}`)).status).toBe(200);

    for (const path of ['/api/uploads', `/api/uploads/${id}`, '/api/uploads?status=failed']) {
      const official = await w.agent.get(path);
      expect(official.status).toBe(403);
      expect(official.body.error.code).toBe('forbidden');
      expect(JSON.stringify(official.body)).not.toContain('@crestwatch.example');
      expect((await request(w.server).get(path)).status).toBe(401);
    }
  });
});
