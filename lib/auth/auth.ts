import "server-only";
import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { APIError, createAuthMiddleware } from "better-auth/api";
import { nextCookies } from "better-auth/next-js";
import { db } from "@/db/client";
import * as schema from "@/db/schema";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/send-mail";
import { resetPasswordMail, verifyEmailMail } from "@/lib/mail/templates";
import { signUpServerSchema } from "@/lib/validations/profile";

function localTwin(origin: string): string[] {
  // The same server answers on localhost and 127.0.0.1; accept both spellings of our own origin.
  const u = new URL(origin);
  if (u.hostname === "localhost") return [origin, `${u.protocol}//127.0.0.1${u.port ? `:${u.port}` : ""}`];
  if (u.hostname === "127.0.0.1") return [origin, `${u.protocol}//localhost${u.port ? `:${u.port}` : ""}`];
  return [origin];
}

function deliver(kind: string, send: () => Promise<unknown>): void {
  // Not awaited, so the reply does not reveal through its timing whether an account exists.
  send().catch((error: unknown) => console.error(`[mail] ${kind} failed`, error));
}

export const auth = betterAuth({
  appName: "Shoal",
  baseURL: env.APP_URL,
  secret: env.BETTER_AUTH_SECRET,
  trustedOrigins: localTwin(env.APP_URL),
  telemetry: { enabled: false },
  database: drizzleAdapter(db, {
    provider: "sqlite",
    schema: {
      user: schema.user,
      session: schema.session,
      account: schema.account,
      verification: schema.verification,
      rateLimit: schema.rateLimit,
    },
  }),
  emailAndPassword: {
    enabled: true,
    requireEmailVerification: true,
    minPasswordLength: 10,
    maxPasswordLength: 128,
    resetPasswordTokenExpiresIn: 60 * 60,
    revokeSessionsOnPasswordReset: true,
    sendResetPassword: async ({ user, url }) => {
      deliver("reset-password", () => sendMail(resetPasswordMail({ name: user.name, url }), user.email));
    },
  },
  emailVerification: {
    sendOnSignUp: true,
    sendOnSignIn: true,
    autoSignInAfterVerification: true,
    expiresIn: 24 * 60 * 60,
    sendVerificationEmail: async ({ user, url }) => {
      deliver("verify-email", () => sendMail(verifyEmailMail({ name: user.name, url }), user.email));
    },
  },
  session: {
    expiresIn: 60 * 60 * 24 * 30,
    updateAge: 60 * 60 * 24,
  },
  rateLimit: {
    enabled: true,
    storage: "database",
    window: 60,
    max: 200,
    customRules: {
      "/sign-in/email": { window: 60, max: env.AUTH_SIGN_IN_PER_MINUTE },
      "/sign-up/email": { window: 60, max: env.AUTH_SIGN_UP_PER_MINUTE },
      "/request-password-reset": { window: 60, max: 5 },
    },
  },
  hooks: {
    // The sign-up form's rules hold on the server too, for requests that skip the form.
    before: createAuthMiddleware(async (ctx) => {
      if (ctx.path !== "/sign-up/email") return;
      const parsed = signUpServerSchema.safeParse(ctx.body);
      if (!parsed.success) {
        const issue = parsed.error.issues[0];
        throw new APIError("BAD_REQUEST", { message: issue ? `${issue.path.join(".")}: ${issue.message}` : "Invalid sign-up" });
      }
    }),
  },
  plugins: [nextCookies()],
});

export type AuthSession = typeof auth.$Infer.Session;
