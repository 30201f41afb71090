import { z } from "zod";
import { json, readJson, route } from "@/lib/http/handler";
import { AppError } from "@/lib/http/errors";
import { mailPurchaseList, requirePlan } from "@/lib/services/plans";
import { emailSchema } from "@/lib/validation/auth";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** Mails the purchase list (CSV attached) to a supplier or purchaser; recorded in the audit trail. */
export const POST = route("POST /api/plans/[planId]/purchase-mail", async ({ me, params, req }) => {
  const plan = await requirePlan(me.teamId, params.planId);
  const { to } = await readJson(req, z.object({ to: emailSchema }));
  const sent = await mailPurchaseList(me, plan.id, to);
  if (!sent.ok) throw new AppError(502, "mail_failed", `The purchase list was not sent: ${sent.error}`);
  return json({ sent: true, to }, 202);
});
