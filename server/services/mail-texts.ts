// The words of the mails the app sends. Plain text: it reads the same in every client.

export function invitationMail(p: { to: string; link: string; role: string; organizationName: string | null; invitedBy: string; expiresAt: Date }) {
  return {
    to: p.to,
    subject: "You are invited to Fluxwright",
    text: [
      `Hello,`,
      ``,
      `${p.invitedBy} has invited you to Fluxwright as ${p.role}${p.organizationName ? ` for ${p.organizationName}` : ""}.`,
      `Choose your name and password here:`,
      ``,
      p.link,
      ``,
      `The link works once and expires on ${p.expiresAt.toUTCString()}.`,
      `If you did not expect this, ignore this mail.`,
    ].join("\n"),
  };
}

export function passwordResetMail(p: { to: string; link: string; expiresAt: Date }) {
  return {
    to: p.to,
    subject: "Reset your Fluxwright password",
    text: [
      `Hello,`,
      ``,
      `Someone asked to reset the password of this Fluxwright account. To choose a new one, open:`,
      ``,
      p.link,
      ``,
      `The link works once and expires on ${p.expiresAt.toUTCString()}.`,
      `If it was not you, ignore this mail: your password stays as it is.`,
    ].join("\n"),
  };
}

export function welcomeMail(p: { to: string; name: string; organizationName: string; appUrl: string }) {
  return {
    to: p.to,
    subject: "Welcome to Fluxwright",
    text: [
      `Hello ${p.name},`,
      ``,
      `Your account for ${p.organizationName} is ready. Sign in at ${p.appUrl}/sign-in to check designs, get quotes and follow your orders.`,
    ].join("\n"),
  };
}

/** To the owner of an address someone tried to register again: no account is made, nobody is signed in. */
export function registrationAttemptMail(p: { to: string; appUrl: string }) {
  return {
    to: p.to,
    subject: "Someone tried to create a Fluxwright account with your address",
    text: [
      `Hello,`,
      ``,
      `Someone tried to create a new Fluxwright account with this address, which already has one. No new account was made and nothing about your account changed.`,
      ``,
      `If it was you, sign in at ${p.appUrl}/sign-in, or choose a new password at ${p.appUrl}/forgot-password.`,
      `If it was not you, you can ignore this mail.`,
    ].join("\n"),
  };
}
