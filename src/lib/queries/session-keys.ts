/** The signed-in session's query key (the rest are in keys.ts). */
export const sessionKeys = {
  all: ['auth'] as const,
  /** GET /api/auth/session */
  session: ['auth', 'session'] as const,
};
