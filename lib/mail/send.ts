// Sending mail over SMTP (SMTP_URL), with short timeouts so a mail server that is down never hangs a request.
import nodemailer from "nodemailer";
import { env } from "@/lib/env";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  attachments?: { filename: string; content: string | Buffer; contentType: string }[];
}

export type SendResult = { ok: true; messageId: string } | { ok: false; error: string };

type Transport = ReturnType<typeof nodemailer.createTransport>;
const g = globalThis as unknown as { loomwrightMail?: { url: string; transport: Transport } };

/** smtp://[user:pass@]host:port (plain, STARTTLS when offered) or smtps:// (TLS from the start). */
export function transportOptions(smtpUrl: string) {
  const u = new URL(smtpUrl);
  if (u.protocol !== "smtp:" && u.protocol !== "smtps:")
    throw new Error("SMTP_URL must be smtp:// or smtps://");
  const secure = u.protocol === "smtps:";
  return {
    host: u.hostname,
    port: u.port ? Number(u.port) : secure ? 465 : 587,
    secure,
    auth: u.username
      ? { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) }
      : undefined,
    connectionTimeout: 3000,
    greetingTimeout: 3000,
    socketTimeout: 5000,
  };
}

function transport(): Transport {
  const url = env().SMTP_URL;
  if (!g.loomwrightMail || g.loomwrightMail.url !== url) {
    g.loomwrightMail = { url, transport: nodemailer.createTransport(transportOptions(url)) };
  }
  return g.loomwrightMail.transport;
}

/** Sends one mail; never throws: a failure comes back as a short reason to store beside the record. */
export async function sendMail(mail: OutgoingMail): Promise<SendResult> {
  try {
    const info = await transport().sendMail({ from: env().MAIL_FROM, ...mail });
    if (info.rejected.length > 0) return { ok: false, error: "The mail server refused the address." };
    return { ok: true, messageId: info.messageId };
  } catch (e) {
    const code = (e as { code?: unknown }).code;
    console.error("[mail] sending failed:", e instanceof Error ? e.message : e);
    return {
      ok: false,
      error:
        code === "ETIMEDOUT"
          ? "The mail server did not answer in time."
          : code === "ECONNECTION" || code === "ESOCKET"
            ? "The mail server could not be reached."
            : "The mail server did not accept the message.",
    };
  }
}
