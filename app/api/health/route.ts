import { NextResponse } from 'next/server';
import { db } from '@/models';

export const dynamic = 'force-dynamic';

/** 200 only when the database answers. Public, and says nothing but ok/unavailable. */
export async function GET() {
  try {
    await db().sequelize.query('SELECT 1');
    return NextResponse.json({ status: 'ok' });
  } catch {
    return NextResponse.json({ status: 'unavailable' }, { status: 503 });
  }
}
