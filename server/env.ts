import { z } from 'zod';

/** Settings production cannot run without (outside production each has a local stand-in). */
const PRODUCTION_REQUIRED = [
  'SESSION_SECRET',
  'PUBLIC_URL',
  'SMTP_HOST',
  'STRIPE_SECRET_KEY',
  'STRIPE_WEBHOOK_SECRET',
] as const;

/** Environment, parsed once at start-up; a bad variable stops the server and says which. */
const EnvSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().min(1).default('127.0.0.1'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    DATABASE_URL: z
      .string({ error: 'DATABASE_URL is required (npm start sets it to the project database)' })
      .regex(/^postgres(ql)?:\/\//, 'DATABASE_URL must be a postgres:// URL'),
    SESSION_SECRET: z.string().min(16, 'SESSION_SECRET must be at least 16 characters').optional(),
    PUBLIC_URL: z.url('PUBLIC_URL must be a full URL such as https://sixfold.example').optional(),
    SEED_DEMO: z.enum(['0', '1']).default('0'),
    TRUST_PROXY: z.enum(['0', '1']).default('0'),
    // Secure on cookies: 1 always (the production default), 0 never (a plain-HTTP trial), auto over HTTPS.
    COOKIE_SECURE: z.enum(['auto', '0', '1']).optional(),
    LOG_LEVEL: z.enum(['silent', 'error', 'warn', 'info', 'debug']).optional(),
    // Mail: a real relay. Unset outside production, the server runs a fake SMTP server of its own
    // on a free loopback port (each instance its own) and files the mail in dev_outbox.
    SMTP_HOST: z.string().min(1).optional(),
    SMTP_PORT: z.coerce.number().int().min(1).max(65535).optional(),
    SMTP_SECURE: z.enum(['0', '1']).default('0'),
    SMTP_USER: z.string().min(1).optional(),
    SMTP_PASS: z.string().min(1).optional(),
    MAIL_FROM: z.string().min(3).default('Sixfold <desk@sixfold.test>'),
    // Failed sign-ins from one source across accounts in 15 minutes before that source is slowed down.
    SIGN_IN_IP_LIMIT: z.coerce.number().int().min(1).default(20),
    // Sign-ups from one address an hour, reset requests from one address in 15 minutes, invites a teacher sends an hour.
    SIGN_UP_IP_LIMIT: z.coerce.number().int().min(1).default(10),
    RESET_IP_LIMIT: z.coerce.number().int().min(1).default(20),
    INVITE_LIMIT: z.coerce.number().int().min(1).default(50),
    // Payments: the hosted checkout's SDK; outside production it talks to the local fake on this host and port.
    STRIPE_SECRET_KEY: z.string().min(8, 'STRIPE_SECRET_KEY looks too short').optional(),
    STRIPE_WEBHOOK_SECRET: z.string().min(8, 'STRIPE_WEBHOOK_SECRET looks too short').optional(),
    PAYMENTS_API_HOST: z.string().min(1).optional(),
    PAYMENTS_API_PORT: z.coerce.number().int().min(0).max(65535).optional(),
    PAYMENTS_API_PROTOCOL: z.enum(['http', 'https']).optional(),
  })
  .superRefine((env, ctx) => {
    for (const name of PRODUCTION_REQUIRED) {
      if (env.NODE_ENV === 'production' && !env[name])
        ctx.addIssue({ code: 'custom', path: [name], message: `${name} is required in production` });
    }
  });

export type Env = Omit<z.infer<typeof EnvSchema>, 'COOKIE_SECURE' | 'LOG_LEVEL'> & {
  COOKIE_SECURE: 'auto' | '0' | '1';
  LOG_LEVEL: 'silent' | 'error' | 'warn' | 'info' | 'debug';
  SESSION_SECRET: string;
  STRIPE_SECRET_KEY: string;
  STRIPE_WEBHOOK_SECRET: string;
};

export class EnvError extends Error {}

export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  - ${i.path.join('.') || '(env)'}: ${i.message}`);
    // A bad variable stops the checks that need the whole object; still name every missing setting.
    if (source.NODE_ENV === 'production') {
      for (const name of PRODUCTION_REQUIRED) {
        if (!source[name] && !parsed.error.issues.some((i) => i.path[0] === name))
          lines.push(`  - ${name}: ${name} is required in production`);
      }
    }
    throw new EnvError(`Bad environment variables:\n${lines.join('\n')}`);
  }
  const production = parsed.data.NODE_ENV === 'production';
  return {
    ...parsed.data,
    COOKIE_SECURE: parsed.data.COOKIE_SECURE ?? (production ? '1' : 'auto'),
    LOG_LEVEL: parsed.data.LOG_LEVEL ?? (parsed.data.NODE_ENV === 'test' ? 'silent' : 'info'),
    SESSION_SECRET: parsed.data.SESSION_SECRET ?? 'sixfold-development-secret-not-for-production',
    // Development defaults, known to the local checkout fake; production must set both.
    STRIPE_SECRET_KEY: parsed.data.STRIPE_SECRET_KEY ?? 'sk_test_sixfold_local_fake',
    STRIPE_WEBHOOK_SECRET: parsed.data.STRIPE_WEBHOOK_SECRET ?? 'whsec_sixfold_local_fake',
  };
}
