/**
 * Forged cross-site requests: every state-changing API route (read from the Express routers, so
 * routes added later are covered too) is called as a signed-in owner from another site's page —
 * JSON bodies, bodiless POSTs, multipart uploads and DELETEs alike — and must be refused with
 * 403 cross_site_request before anything runs. The app's own origin still works.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { useTestApp } from '../../support/test-app';
import { signUpOwner } from '../../support/factories';
import { listApiRoutes, type RouteEntry } from '../../../server/lib/route-table';
import { databaseFingerprint } from '../../support/db-fingerprint';

const t = useTestApp();
let owner: Awaited<ReturnType<typeof signUpOwner>>;
let writes: RouteEntry[];

beforeAll(async () => {
  owner = await signUpOwner(t);
  writes = listApiRoutes(t.app).filter((r) => !['GET', 'HEAD', 'OPTIONS'].includes(r.method));
});

function pathOf(route: RouteEntry): string {
  return route.path.replace(/:(\w+)/g, (_m, name: string) =>
    name === 'teamId' ? owner.teamId : name === 'publicId' ? 'AbCdEfGh12' : randomUUID(),
  );
}

/** The owner's session cookie, sent the way a browser sends it on a cross-site request. */
function forged(route: RouteEntry, headers: Record<string, string>) {
  const req = owner.agent[route.method.toLowerCase() as 'post'](pathOf(route));
  for (const [k, v] of Object.entries(headers)) req.set(k, v);
  return req;
}

describe('state-changing routes called from another site', () => {
  it('there are many of them, uploads and bodiless POSTs among them', () => {
    expect(writes.length).toBeGreaterThan(30);
    expect(writes.some((r) => r.path.endsWith('/files'))).toBe(true);
    expect(writes.some((r) => r.path.endsWith('/lifecycle/go-live'))).toBe(true);
  });

  const attacks: [string, Record<string, string>][] = [
    ['a foreign Origin', { Origin: 'https://evil.example' }],
    ['Origin null (sandboxed or privacy-redirected page)', { Origin: 'null' }],
    ['a foreign Referer and no Origin', { Origin: '', Referer: 'https://evil.example/page' }],
    ['neither header, with the session cookie', { Origin: '' }],
  ];

  it.each(attacks)('with %s, every one answers 403 and changes nothing', async (_name, headers) => {
    const before = await databaseFingerprint(t.deps.db);
    for (const route of writes) {
      const req = forged(route, headers);
      const res = await (route.path.endsWith('/files') || route.path.endsWith('/import')
        ? req.attach('file', Buffer.from('block,task\n'), 'x.csv')
        : route.method === 'POST' && route.path.endsWith('/go-live')
          ? req
          : req.send({ name: 'Forged' }));
      expect(res.status, `${route.method} ${route.path}`).toBe(403);
      expect(res.body.error.code).toBe('cross_site_request');
    }
    expect(await databaseFingerprint(t.deps.db)).toEqual(before);
  });

  it('accepts the same request from the app itself (Origin or Referer of APP_URL)', async () => {
    await owner.agent.post('/api/teams').send({ name: 'From our page' }).expect(201);
    await owner.agent
      .post('/api/teams')
      .set('Origin', '')
      .set('Referer', `${t.deps.env.APP_URL}/account`)
      .send({ name: 'From our page too' })
      .expect(201);
  });

  it('lets a cookieless caller without Origin through (one-click unsubscribe from a mail provider)', async () => {
    const res = await t
      .request()
      .post(`/api/unsubscribe/${'x'.repeat(43)}`)
      .set('Origin', '')
      .send('List-Unsubscribe=One-Click');
    expect(res.body.error?.code).not.toBe('cross_site_request');
  });
});
