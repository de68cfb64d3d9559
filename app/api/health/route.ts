import { NextResponse } from 'next/server';
import { health } from '@/lib/health';

export const dynamic = 'force-dynamic';

/**
 * Public. 200 while the database answers and its migrations are current (status 'degraded' when a part
 * of this instance's background work could not start, e.g. the mail capture's port was taken); 503
 * when the database is unreachable or migrations are pending. States and times only, no detail.
 */
export async function GET() {
  try {
    const { httpStatus, body } = await health();
    return NextResponse.json(body, { status: httpStatus, headers: { 'cache-control': 'no-store' } });
  } catch {
    return NextResponse.json({ status: 'unavailable' }, { status: 503, headers: { 'cache-control': 'no-store' } });
  }
}
