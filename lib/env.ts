import { z } from 'zod';

// The environment, parsed once. Every variable has a working default for the embedded set-up;
// a bad value stops start-up with a message naming the variable.
const bool = z
  .enum(['true', 'false', '1', '0', ''])
  .default('false')
  .transform((v) => v === 'true' || v === '1');

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  DATABASE_FILE: z.string().min(1).default('data/thawline.sqlite'),
  DATABASE_URL: z.string().url().optional().or(z.literal('').transform(() => undefined)),
  NEXTAUTH_SECRET: z.string().min(16).default('thawline-embedded-development-secret-change-me'),
  NEXTAUTH_URL: z.string().url().default('http://localhost:3000'),
  FORECAST_BASE_URL: z.string().url().optional().or(z.literal('').transform(() => undefined)),
  FORECAST_TIMEOUT_MS: z.coerce.number().int().min(100).max(120000).default(8000),
  FAKE_FORECAST_SCENARIO: z.string().regex(/^[a-z0-9-]+$/).default('cold-snap'),
  FAKE_FORECAST_FAULT: z.enum(['none', 'slow', 'error500', 'malformed']).default('none'),
  MAP_TILE_URL: z.string().default(''),
  MAP_TILE_ATTRIBUTION: z.string().default(''),
  SMTP_URL: z.string().url().optional().or(z.literal('').transform(() => undefined)),
  MAIL_FROM: z.string().min(3).default('Thawline <no-reply@thawline.test>'),
  SMTP_CAPTURE_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  SIGNIN_MAX_PER_ACCOUNT: z.coerce.number().int().min(1).default(5),
  SIGNIN_MAX_PER_ADDRESS: z.coerce.number().int().min(1).default(20),
  DB_LOG: bool,
  THAWLINE_JOBS: z.enum(['on', 'off']).default('on'),
});

export type Env = z.infer<typeof schema>;

let cached: Env | undefined;

export function env(): Env {
  if (cached) return cached;
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Thawline cannot start: bad environment variable(s)\n${lines}`);
  }
  cached = parsed.data;
  return cached;
}

/** For tests that change process.env between cases. */
export function resetEnvCache() {
  cached = undefined;
}
