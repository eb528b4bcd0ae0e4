// expand[]=a.b.c (Stripe docs: "Expanding responses"): each step swaps an id for its object, through list
// envelopes ("data.customer" on a list, "items.data.price" …), and fills the includable properties Stripe
// only returns on request (a session's line_items, a charge's refunds).
import { invalidParam } from "./errors";
import type { Params } from "./params";
import { listOf, render, sessionLineItems } from "./render";
import type { Store } from "./state";
import type { Json, JsonObject } from "./types";

const isObject = (v: Json | undefined): v is JsonObject => typeof v === "object" && v !== null && !Array.isArray(v);

function includable(store: Store, node: JsonObject, key: string): Json | undefined {
  const id = typeof node.id === "string" ? node.id : "";
  if (node.object === "checkout.session" && key === "line_items") {
    const s = store.find("checkout.session", id);
    return s ? sessionLineItems(store, s) : undefined;
  }
  if (node.object === "charge" && key === "refunds") {
    const refunds = store
      .all("refund")
      .filter((r) => r.charge === id)
      .map((r) => render(store, r));
    return listOf(`/v1/charges/${id}/refunds`, refunds);
  }
  return undefined;
}

function walk(store: Store, node: Json, path: string[], full: string): void {
  if (path.length === 0) return;
  if (Array.isArray(node)) {
    for (const n of node) walk(store, n, path, full);
    return;
  }
  if (!isObject(node)) return;
  const [key, ...rest] = path;
  if (key === undefined) return;
  const extra = includable(store, node, key);
  if (extra !== undefined) node[key] = extra;
  const value = node[key];
  if (typeof value === "string") {
    const target = store.objects.get(value);
    if (!target) throw invalidParam("expand", `This property cannot be expanded (${full}).`);
    node[key] = render(store, target);
  } else if (value === undefined) {
    throw invalidParam("expand", `This property cannot be expanded (${full}).`);
  }
  walk(store, node[key] ?? null, rest, full);
}

export function expand(store: Store, obj: JsonObject, params: Params): JsonObject {
  for (const path of params.expand()) walk(store, obj, path.split("."), path);
  return obj;
}

/**
 * Stripe's cursor pagination: newest first, `limit` 1–100 (default 10), `starting_after` /
 * `ending_before` an id from the previous page (Stripe docs: "Pagination").
 */
export function paginate<T extends { id: string }>(items: T[], params: Params): { data: T[]; hasMore: boolean } {
  const limit = params.int("limit") ?? 10;
  if (limit < 1 || limit > 100)
    throw invalidParam("limit", "Invalid limit: must be between 1 and 100", "parameter_invalid_integer");
  const after = params.str("starting_after");
  const before = params.str("ending_before");
  let start = 0;
  let end = items.length;
  if (after) {
    const at = items.findIndex((i) => i.id === after);
    if (at < 0) throw invalidParam("starting_after", `No such object: '${after}'`, "resource_missing");
    start = at + 1;
  }
  if (before) {
    const at = items.findIndex((i) => i.id === before);
    if (at < 0) throw invalidParam("ending_before", `No such object: '${before}'`, "resource_missing");
    end = at;
    start = Math.max(0, end - limit);
  }
  const data = items.slice(start, Math.min(end, start + limit));
  return { data, hasMore: before ? start > 0 : start + limit < end };
}
