// The one route-handler skeleton: origin check on writes → guard from the access table → handler → JSON; errors
// go through the one mapper.
import { NextResponse, type NextRequest } from "next/server";
import type { z } from "zod";
import { requireAccess, type Me, type TeamMe } from "@/lib/auth/guards";
import { ROUTE_ACCESS, type RouteKey } from "@/lib/auth/access";
import { AppError, forbidden, invalid, mapError, tooLarge } from "@/lib/http/errors";

type AccessOf<K extends RouteKey> = (typeof ROUTE_ACCESS)[K];
export type MeFor<K extends RouteKey> =
  AccessOf<K> extends "public" ? null : AccessOf<K> extends "user" ? Me : TeamMe;

export interface RouteContext<K extends RouteKey> {
  req: NextRequest;
  params: Record<string, string>;
  me: MeFor<K>;
}

type Params = { params: Promise<Record<string, string | string[]>> };

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** Writes from a browser must come from our own origin; clients that send no Origin (scripts, tests) pass. */
function checkSameOrigin(req: NextRequest): void {
  if (SAFE_METHODS.has(req.method)) return;
  const origin = req.headers.get("origin");
  if (!origin) return;
  const host = req.headers.get("x-forwarded-host") ?? req.headers.get("host");
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    throw forbidden("Cross-site request refused.");
  }
  if (!host || originHost !== host) throw forbidden("Cross-site request refused.");
}

export function errorResponse(e: unknown): NextResponse {
  const m = mapError(e);
  if (m.status >= 500 && m.status !== 503) console.error("[api] unhandled error:", e);
  return NextResponse.json(m.body, { status: m.status, headers: m.headers });
}

export function route<K extends RouteKey>(key: K, fn: (ctx: RouteContext<K>) => Promise<unknown>) {
  return async (req: NextRequest, ctx: Params): Promise<Response> => {
    try {
      checkSameOrigin(req);
      const me = (await requireAccess(key)) as MeFor<K>;
      const raw = ctx?.params ? await ctx.params : {};
      const params: Record<string, string> = {};
      for (const [k, v] of Object.entries(raw)) params[k] = Array.isArray(v) ? v.join("/") : v;
      const out = await fn({ req, params, me });
      if (out instanceof Response) return out;
      return NextResponse.json(out ?? { ok: true });
    } catch (e) {
      return errorResponse(e);
    }
  };
}

const MAX_JSON_BYTES = 2 * 1024 * 1024;

/** Reads a JSON body (at most 2 MB) and parses it with a schema; 413 and 422 on bad input. */
export async function readJson<S extends z.ZodType>(req: NextRequest, schema: S): Promise<z.infer<S>> {
  const len = Number(req.headers.get("content-length") ?? "0");
  if (len > MAX_JSON_BYTES) throw tooLarge("The request body is larger than 2 MB.");
  const text = await req.text();
  if (text.length > MAX_JSON_BYTES) throw tooLarge("The request body is larger than 2 MB.");
  let data: unknown;
  try {
    data = text.length ? JSON.parse(text) : {};
  } catch {
    throw invalid("The request body is not valid JSON.");
  }
  return schema.parse(data);
}

/** Parses the query string with a schema (values arrive as strings; schemas coerce). */
export function readQuery<S extends z.ZodType>(req: NextRequest, schema: S): z.infer<S> {
  const obj: Record<string, string> = {};
  req.nextUrl.searchParams.forEach((v, k) => {
    obj[k] = v;
  });
  return schema.parse(obj);
}

export function json(data: unknown, status = 200, headers?: Record<string, string>): NextResponse {
  return NextResponse.json(data, { status, headers });
}

export { AppError };
