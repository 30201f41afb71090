// The product's mails, each as plain text and simple HTML with the same wording.
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

function esc(s: string): string {
  return s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function layout(paragraphs: string[], button: { href: string; label: string }, after: string[]): string {
  const p = (t: string) => `<p style="margin:0 0 14px">${esc(t)}</p>`;
  return `<!doctype html><html><body style="margin:0;background:#f7f5f0;font-family:Arial,Helvetica,sans-serif;color:#1d2433">
<div style="max-width:560px;margin:0 auto;padding:28px 24px">
<p style="margin:0 0 20px;font-weight:bold;font-size:18px;color:#1d2433">Loomwright</p>
<div style="background:#ffffff;border:1px solid #d9d4c8;border-radius:8px;padding:24px;font-size:15px;line-height:1.5">
${paragraphs.map(p).join("\n")}
<p style="margin:20px 0"><a href="${esc(button.href)}" style="display:inline-block;background:#1d2433;color:#f7f5f0;text-decoration:none;font-weight:bold;padding:12px 20px;border-radius:6px">${esc(button.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;color:#4a5366">Or paste this address into your browser:<br><span style="word-break:break-all">${esc(button.href)}</span></p>
${after.map(p).join("\n")}
</div></div></body></html>`;
}

export function invitationMail(input: {
  teamName: string;
  inviterName: string | null;
  role: Role;
  link: string;
  expiresAt: Date;
}): MailContent {
  const who = input.inviterName ? `${input.inviterName} has invited you` : "You have been invited";
  const role = ROLE_LABELS[input.role].toLowerCase();
  const until = input.expiresAt.toUTCString().replace(/:\d\d GMT$/, " UTC");
  const intro = `${who} to join ${input.teamName} on Loomwright as a ${role}.`;
  const what =
    "Loomwright keeps the team's harness work in one place: run lists and cut lengths, electrical checks, spool plans, cut sheets and the markers printed for every wire.";
  const expiry = `The link works once and expires on ${until}. If you were not expecting this, you can ignore this mail.`;
  return {
    subject: `You are invited to ${input.teamName} on Loomwright`,
    text: `${intro}\n\n${what}\n\nAccept the invitation:\n${input.link}\n\n${expiry}\n`,
    html: layout([intro, what], { href: input.link, label: "Accept the invitation" }, [expiry]),
  };
}

export function passwordResetMail(input: { name: string; link: string }): MailContent {
  const hello = `Hello ${input.name},`;
  const why = "Someone asked to set a new password for your Loomwright account.";
  const after =
    "The link works once and expires in one hour. Setting a new password signs you out on every other device. If you did not ask for this, ignore this mail: your password stays as it is.";
  return {
    subject: "Set a new Loomwright password",
    text: `${hello}\n\n${why}\n\nSet a new password:\n${input.link}\n\n${after}\n`,
    html: layout([hello, why], { href: input.link, label: "Set a new password" }, [after]),
  };
}
