"use client";

// The four sign-in calls the auth pages make, as plain requests to better-auth's HTTP
// endpoints (/api/auth/*). Its full client library would add tens of kilobytes to
// pages that people open on slow, costly connections.
export type AuthError = { status: number; code?: string; message?: string };
export type AuthResult = { error: AuthError | null };

async function post(path: string, body: Record<string, unknown>): Promise<AuthResult> {
  try {
    const response = await fetch(`/api/auth${path}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
    if (response.ok) return { error: null };
    const json = (await response.json().catch(() => ({}))) as { code?: string; message?: string };
    return { error: { status: response.status, code: json.code, message: json.message } };
  } catch {
    return { error: { status: 0, message: "You seem to be offline. Check your connection and try again." } };
  }
}

export const authApi = {
  signUp: (b: { name: string; email: string; password: string; callbackURL: string }) => post("/sign-up/email", b),
  signIn: (b: { email: string; password: string; callbackURL: string }) => post("/sign-in/email", b),
  requestPasswordReset: (b: { email: string; redirectTo: string }) => post("/request-password-reset", b),
  resetPassword: (b: { newPassword: string; token: string }) => post("/reset-password", b),
};
