"use client";
// The Team screen: members with roles and open invitations for everyone; inviting, resending, revoking, role
// changes and removals for leads only (the API refuses the others whatever the screen shows).
import { useState, type FormEvent } from "react";
import { useRouter } from "next/navigation";
import { ApiError, sendJson } from "@/lib/client/fetcher";
import { useTeam } from "@/lib/client/use-team";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/auth/roles";
import type { InvitationRecord, MemberRecord } from "@/lib/db/team";
import type { InvitationOutcome } from "@/lib/services/team";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SelectField } from "@/components/ui/select-field";
import { SkeletonRows } from "@/components/ui/skeleton";

type Message = { tone: "ok" | "caution" | "error"; title?: string; text: string } | null;

const ROLE_HINTS: Record<Role, string> = {
  lead: "everything in the team, members included",
  builder: "reads everything, records bench progress, prints",
  technician: "reads everything, records tests, scans",
};

function day(iso: string): string {
  return new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric" });
}

function errorText(e: unknown): string {
  return e instanceof Error ? e.message : "Something went wrong.";
}

function outcomeMessage(o: InvitationOutcome, verb: string): Message {
  if (o.mailSent) return { tone: "ok", text: `Invitation ${verb} to ${o.invitation.email}.` };
  return {
    tone: "caution",
    title: "Invitation saved, mail not sent",
    text: `${o.mailError ?? "The mail server did not take the message."} The invitation to ${o.invitation.email} is kept: use Resend when the mail server answers again.`,
  };
}

export function TeamScreen({ canManage }: { canManage: boolean }) {
  const { data, error, isLoading, mutate } = useTeam();
  const [message, setMessage] = useState<Message>(null);

  if (error && !data) {
    return (
      <Notice tone="error" title="The team could not be loaded">
        <p>{errorText(error)}</p>
        <Button variant="secondary" size="sm" className="mt-2" onClick={() => void mutate()}>
          Try again
        </Button>
      </Notice>
    );
  }
  if (isLoading || !data) return <SkeletonRows rows={6} label="Loading the team" />;

  const act = async (fn: () => Promise<Message>) => {
    try {
      setMessage(await fn());
    } catch (e) {
      setMessage({ tone: "error", text: errorText(e) });
    } finally {
      await mutate();
    }
  };

  return (
    <div className="flex flex-col gap-6">
      <div>
        <p className="text-sm font-semibold uppercase tracking-wide text-copper-dark">{data.team.name}</p>
        <h1 className="text-2xl font-bold">Team</h1>
        <p className="text-sm text-ink-soft">
          {canManage
            ? "Invite people by e-mail, choose their role, and remove those who have left."
            : "Who is in the team and what each role may do. Only a lead can change it."}
        </p>
      </div>
      {message ? (
        <Notice tone={message.tone} title={message.title}>
          {message.text}
        </Notice>
      ) : null}
      {canManage ? <InviteForm onDone={(m) => void act(async () => m)} /> : null}
      <MemberList members={data.members} meId={data.me.userId} canManage={canManage} act={act} />
      <InvitationList invitations={data.invitations} canManage={canManage} act={act} />
    </div>
  );
}

function InviteForm({ onDone }: { onDone: (m: Message) => void }) {
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<Role>("builder");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [pending, setPending] = useState(false);

  const submit = async (ev: FormEvent) => {
    ev.preventDefault();
    setPending(true);
    setErrors({});
    try {
      const o = await sendJson<InvitationOutcome>("/api/team/invitations", "POST", { email, role });
      setEmail("");
      onDone(outcomeMessage(o, "sent"));
    } catch (e) {
      if (e instanceof ApiError && e.status === 422 && Array.isArray(e.details)) {
        const next: Record<string, string> = {};
        for (const d of e.details as { path: string; message: string }[]) next[d.path] ??= d.message;
        setErrors(next);
      } else onDone({ tone: "error", text: errorText(e) });
    } finally {
      setPending(false);
    }
  };

  return (
    <section
      aria-labelledby="invite-heading"
      className="rounded-lg border border-line bg-white p-5 shadow-sm"
    >
      <h2 id="invite-heading" className="mb-3 text-lg font-semibold">
        Invite someone
      </h2>
      <form
        onSubmit={(e) => void submit(e)}
        noValidate
        className="grid gap-4 sm:grid-cols-[1fr_14rem_auto] sm:items-start"
      >
        <Field
          id="invite-email"
          label="E-mail"
          type="email"
          autoComplete="off"
          value={email}
          onChange={(e) => setEmail(e.target.value)}
          error={errors.email}
          placeholder="name@example.test"
        />
        <SelectField
          id="invite-role"
          label="Role"
          value={role}
          onChange={(e) => setRole(e.target.value as Role)}
          error={errors.role}
          hint={ROLE_HINTS[role]}
        >
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </SelectField>
        <Button type="submit" disabled={pending} className="sm:mt-6">
          {pending ? "Sending…" : "Send invitation"}
        </Button>
      </form>
      <p className="mt-3 text-xs text-ink-faint">The link in the mail works once and expires after 7 days.</p>
    </section>
  );
}

function RoleBadge({ role }: { role: Role }) {
  return (
    <span className="inline-flex rounded bg-paper-deep px-2 py-0.5 text-xs font-bold uppercase tracking-wide text-ink">
      {ROLE_LABELS[role]}
    </span>
  );
}

function MemberList({
  members,
  meId,
  canManage,
  act,
}: {
  members: MemberRecord[];
  meId: string;
  canManage: boolean;
  act: (fn: () => Promise<Message>) => Promise<void>;
}) {
  const [confirming, setConfirming] = useState<string | null>(null);
  const router = useRouter();
  return (
    <section aria-labelledby="members-heading" className="flex flex-col gap-3">
      <h2 id="members-heading" className="text-lg font-semibold">
        Members <span className="text-sm font-normal text-ink-faint">({members.length})</span>
      </h2>
      <ul
        className="divide-y divide-line overflow-hidden rounded-lg border border-line bg-white shadow-sm"
        aria-label="Members"
      >
        {members.map((m) => (
          <li key={m.userId} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3">
            <div className="min-w-0 w-full sm:w-auto sm:flex-1">
              <p className="font-semibold">
                {m.name}
                {m.userId === meId ? (
                  <span className="ml-2 text-xs font-normal text-ink-faint">(you)</span>
                ) : null}
              </p>
              <p className="truncate text-sm text-ink-soft">{m.email}</p>
            </div>
            <p className="hidden text-xs text-ink-faint md:block">joined {day(m.joinedAt)}</p>
            {canManage ? (
              <label className="flex items-center gap-2 text-sm">
                <span className="sr-only">Role of {m.name}</span>
                <select
                  value={m.role}
                  className="h-10 rounded-md border border-line-strong bg-white px-2 text-sm"
                  onChange={(e) => {
                    const role = e.target.value as Role;
                    void act(async () => {
                      await sendJson(`/api/team/members/${encodeURIComponent(m.userId)}`, "PATCH", { role });
                      // A lead who changes their own role sees the screen of the new role.
                      if (m.userId === meId) window.location.reload();
                      return { tone: "ok", text: `${m.name} is now a ${ROLE_LABELS[role].toLowerCase()}.` };
                    });
                  }}
                >
                  {ROLES.map((r) => (
                    <option key={r} value={r}>
                      {ROLE_LABELS[r]}
                    </option>
                  ))}
                </select>
              </label>
            ) : (
              <RoleBadge role={m.role} />
            )}
            {canManage ? (
              confirming === m.userId ? (
                <span className="flex items-center gap-2">
                  <span className="text-sm">Remove {m.name}?</span>
                  <Button
                    variant="danger"
                    size="sm"
                    onClick={() => {
                      setConfirming(null);
                      void act(async () => {
                        await sendJson(`/api/team/members/${encodeURIComponent(m.userId)}`, "DELETE");
                        if (m.userId === meId) router.push("/sign-in");
                        return { tone: "ok", text: `${m.name} was removed from the team and signed out.` };
                      });
                    }}
                  >
                    Remove
                  </Button>
                  <Button variant="quiet" size="sm" onClick={() => setConfirming(null)}>
                    Cancel
                  </Button>
                </span>
              ) : (
                <Button variant="secondary" size="sm" onClick={() => setConfirming(m.userId)}>
                  Remove…
                </Button>
              )
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}

const STATUS: Record<string, { label: string; cls: string }> = {
  pending: { label: "Sent", cls: "border-pass text-pass" },
  unsent: { label: "Not sent", cls: "border-warn text-warn" },
  expired: { label: "Expired", cls: "border-fail text-fail" },
};

function InvitationList({
  invitations,
  canManage,
  act,
}: {
  invitations: InvitationRecord[];
  canManage: boolean;
  act: (fn: () => Promise<Message>) => Promise<void>;
}) {
  return (
    <section aria-labelledby="invitations-heading" className="flex flex-col gap-3">
      <h2 id="invitations-heading" className="text-lg font-semibold">
        Open invitations <span className="text-sm font-normal text-ink-faint">({invitations.length})</span>
      </h2>
      {invitations.length === 0 ? (
        <p className="rounded-lg border border-dashed border-line-strong bg-white/60 px-4 py-6 text-center text-sm text-ink-soft">
          No open invitations. {canManage ? "Invite someone above; they appear here until they accept." : ""}
        </p>
      ) : (
        <ul
          className="divide-y divide-line overflow-hidden rounded-lg border border-line bg-white shadow-sm"
          aria-label="Open invitations"
        >
          {invitations.map((i) => {
            const s = STATUS[i.status] ?? STATUS.pending!;
            return (
              <li key={i.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3">
                <div className="min-w-0 w-full sm:w-auto sm:flex-1">
                  <p className="truncate font-semibold">{i.email}</p>
                  <p className="text-sm text-ink-soft">
                    {ROLE_LABELS[i.role]} · invited {day(i.createdAt)}
                    {i.invitedByName ? ` by ${i.invitedByName}` : ""} ·{" "}
                    {i.status === "expired" ? `expired ${day(i.expiresAt)}` : `expires ${day(i.expiresAt)}`}
                  </p>
                  {i.status === "unsent" && i.sendError ? (
                    <p className="text-sm text-warn">{i.sendError}</p>
                  ) : null}
                </div>
                <span
                  className={`rounded border px-2 py-0.5 text-xs font-bold uppercase tracking-wide ${s.cls}`}
                >
                  {s.label}
                </span>
                {canManage ? (
                  <span className="flex gap-2">
                    <Button
                      variant="secondary"
                      size="sm"
                      onClick={() =>
                        void act(async () =>
                          outcomeMessage(
                            await sendJson<InvitationOutcome>(`/api/team/invitations/${i.id}/resend`, "POST"),
                            "sent again",
                          ),
                        )
                      }
                    >
                      Resend
                    </Button>
                    <Button
                      variant="quiet"
                      size="sm"
                      onClick={() =>
                        void act(async () => {
                          await sendJson(`/api/team/invitations/${i.id}`, "DELETE");
                          return {
                            tone: "ok",
                            text: `The invitation to ${i.email} was revoked; its link no longer works.`,
                          };
                        })
                      }
                    >
                      Revoke
                    </Button>
                  </span>
                ) : null}
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
