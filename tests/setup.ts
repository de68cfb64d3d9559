// Shared test set-up: 'server-only' throws outside a React Server Component bundle, so it is stubbed here.
import { vi } from 'vitest';
vi.mock('server-only', () => ({}));
