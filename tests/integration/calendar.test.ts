import { beforeAll, describe, expect, it } from 'vitest';
import { call, DEMO, freshDatabase, signInAs, signOut } from './helpers';

let feeds: typeof import('@/app/api/calendar-feeds/route');
let feed: typeof import('@/app/api/calendar-feeds/[id]/route');
let pub: typeof import('@/app/api/calendar/[token]/route');

beforeAll(async () => {
  await freshDatabase();
  feeds = await import('@/app/api/calendar-feeds/route');
  feed = await import('@/app/api/calendar-feeds/[id]/route');
  pub = await import('@/app/api/calendar/[token]/route');
}, 120_000);

async function fetchFeed(url: string) {
  const token = url.split('/').pop()!;
  const res = await pub.GET(new Request(url), { params: Promise.resolve({ token }) });
  return { status: res.status, text: await res.text() };
}

describe('iCalendar feed of switch-on events', () => {
  it('is for operators: a pilot is refused (403), nobody signed in is 401', async () => {
    signOut();
    expect((await call(feeds.GET)).status).toBe(401);
    await signInAs(DEMO.pilot);
    expect((await call(feeds.POST, { method: 'POST', body: {} })).status).toBe(403);
  });

  it('serves switch-on events at a secret URL until revoked', async () => {
    await signInAs(DEMO.operator);
    const made = await call(feeds.POST, { method: 'POST', body: {} });
    expect(made.status).toBe(201);
    const got = await fetchFeed(made.body.url);
    expect(got.status).toBe(200);
    expect(got.text).toContain('BEGIN:VCALENDAR');
    expect(got.text).toContain('BEGIN:VEVENT');
    expect(got.text).toMatch(/SUMMARY:Switch on .*: Q-/);
    expect(got.text).toContain('BEGIN:VALARM');
    const revoked = await call(feed.DELETE, { method: 'DELETE', params: { id: String(made.body.id) } });
    expect(revoked.status).toBe(200);
    expect((await fetchFeed(made.body.url)).status).toBe(404);
  });

  it('an unknown token is 404; an airfield of another organization is 404', async () => {
    expect((await fetchFeed('http://localhost/api/calendar/not-a-real-token-aaaaaaaaaaaa')).status).toBe(404);
    const { db } = await import('@/models');
    const other = await db().Airfield.findOne({ where: { organizationId: 2 } });
    await signInAs(DEMO.operator);
    expect((await call(feeds.POST, { method: 'POST', body: { airfieldId: other!.id } })).status).toBe(404);
    expect((await call(feeds.POST, { method: 'POST', body: { airfieldId: 'x' } })).status).toBe(422);
  });
});
