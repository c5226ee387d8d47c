import { z } from 'zod';

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
    // Mail: in development and test the server runs its own fake SMTP server on this port.
    SMTP_HOST: z.string().min(1).default('127.0.0.1'),
    SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
    SMTP_SECURE: z.enum(['0', '1']).default('0'),
    SMTP_USER: z.string().min(1).optional(),
    SMTP_PASS: z.string().min(1).optional(),
    MAIL_FROM: z.string().min(3).default('Sixfold <desk@sixfold.test>'),
    // Failed sign-ins from one IP within a minute before a 429; tests raise it, since they all come from 127.0.0.1.
    SIGN_IN_IP_LIMIT: z.coerce.number().int().min(1).default(5),
    // Payments: the hosted checkout's SDK; outside production it talks to the local fake on this host and port.
    STRIPE_SECRET_KEY: z.string().min(8, 'STRIPE_SECRET_KEY looks too short').optional(),
    STRIPE_WEBHOOK_SECRET: z.string().min(8, 'STRIPE_WEBHOOK_SECRET looks too short').optional(),
    PAYMENTS_API_HOST: z.string().min(1).optional(),
    PAYMENTS_API_PORT: z.coerce.number().int().min(0).max(65535).optional(),
    PAYMENTS_API_PROTOCOL: z.enum(['http', 'https']).optional(),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'SESSION_SECRET is required in production' });
    }
    for (const name of ['STRIPE_SECRET_KEY', 'STRIPE_WEBHOOK_SECRET'] as const) {
      if (env.NODE_ENV === 'production' && !env[name])
        ctx.addIssue({ code: 'custom', path: [name], message: `${name} is required in production` });
    }
  });

export type Env = z.infer<typeof EnvSchema> & {
  SESSION_SECRET: string;
  STRIPE_SECRET_KEY: string;
  STRIPE_WEBHOOK_SECRET: string;
};

export class EnvError extends Error {}

export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  - ${i.path.join('.') || '(env)'}: ${i.message}`);
    throw new EnvError(`Bad environment variables:\n${lines.join('\n')}`);
  }
  return {
    ...parsed.data,
    SESSION_SECRET: parsed.data.SESSION_SECRET ?? 'sixfold-development-secret-not-for-production',
    // Development defaults, known to the local checkout fake; production must set both.
    STRIPE_SECRET_KEY: parsed.data.STRIPE_SECRET_KEY ?? 'sk_test_sixfold_local_fake',
    STRIPE_WEBHOOK_SECRET: parsed.data.STRIPE_WEBHOOK_SECRET ?? 'whsec_sixfold_local_fake',
  };
}
