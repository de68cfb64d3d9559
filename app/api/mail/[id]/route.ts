import { apiRoute, idParam } from '@/lib/api/route';
import { getCapturedMail } from '@/lib/data/mail';

export const dynamic = 'force-dynamic';

/** One captured message: headers, plain text, HTML and the source as received. */
export const GET = apiRoute({ permission: 'mail:view' }, async ({ user, params }) => ({ message: await getCapturedMail({ orgId: user.orgId, id: idParam(params), viewerEmail: user.email }) }));
