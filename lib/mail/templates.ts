import { composeMail, type RenderedMail } from "./layout";

// Account e-mails. Each domain keeps its own templates beside this file (one function per message).

export function verifyEmailMail(data: { name: string; url: string }): RenderedMail {
  return composeMail(
    "verify-email",
    "Confirm your e-mail for Shoal",
    "Confirm your e-mail",
    [`Hello ${data.name},`, "Confirm this e-mail address to finish opening your Shoal account. The link works for 24 hours.", "If you did not sign up, you can ignore this message."],
    { label: "Confirm e-mail", url: data.url },
  );
}

export function resetPasswordMail(data: { name: string; url: string }): RenderedMail {
  return composeMail(
    "reset-password",
    "Set a new Shoal password",
    "Set a new password",
    [`Hello ${data.name},`, "Someone asked to set a new password for your Shoal account. The link works for one hour.", "If it was not you, ignore this message: your password stays as it is."],
    { label: "Choose a new password", url: data.url },
  );
}
