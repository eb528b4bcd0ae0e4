// Request parameters. The SDK sends form-encoded bodies (GET/DELETE: the query string) with bracketed keys
// — items[0][price]=…, metadata[plan]=…, expand[0]=… — built by its own stringifyRequestData
// (node_modules/stripe/cjs/utils.js), which it documents as "compatible with the qs library's indexed
// array format"; so qs parses them back. Everything arrives as strings: these readers coerce and answer
// with Stripe's 400s.
import qs from "qs";
import { invalidParam, missingParam } from "./errors";
import type { Metadata } from "./types";

type Raw = qs.ParsedQs[string];

export function parseForm(text: string): qs.ParsedQs {
  // arrayLimit raised so items[25] stays an array; depth covers subscription_details[items][0][price].
  return qs.parse(text, { arrayLimit: 200, depth: 8, parameterLimit: 5000 });
}

export class Params {
  constructor(
    readonly raw: qs.ParsedQs,
    private readonly prefix = "",
  ) {}

  private name(key: string): string {
    return this.prefix ? `${this.prefix}[${key}]` : key;
  }

  has(key: string): boolean {
    return this.raw[key] !== undefined;
  }

  str(key: string): string | undefined {
    const v = this.raw[key];
    if (v === undefined) return undefined;
    if (typeof v !== "string")
      throw invalidParam(this.name(key), `Invalid string: ${this.name(key)} must be a string.`);
    return v;
  }

  reqStr(key: string): string {
    const v = this.str(key);
    if (v === undefined || v === "") throw missingParam(this.name(key));
    return v;
  }

  /** "" is Stripe's way of unsetting a nullable field. */
  nullableStr(key: string): string | null | undefined {
    const v = this.str(key);
    return v === "" ? null : v;
  }

  oneOf<T extends string>(key: string, allowed: readonly T[]): T | undefined {
    const v = this.str(key);
    if (v === undefined) return undefined;
    if (!(allowed as readonly string[]).includes(v)) {
      throw invalidParam(this.name(key), `Invalid ${this.name(key)}: must be one of ${allowed.join(", ")}`);
    }
    return v as T;
  }

  int(key: string): number | undefined {
    const v = this.str(key);
    if (v === undefined) return undefined;
    if (!/^-?\d+$/.test(v)) {
      throw invalidParam(this.name(key), `Invalid integer: ${v}`, "parameter_invalid_integer");
    }
    return Number(v);
  }

  bool(key: string): boolean | undefined {
    const v = this.str(key);
    if (v === undefined) return undefined;
    if (v !== "true" && v !== "false") throw invalidParam(this.name(key), `Invalid boolean: ${v}`);
    return v === "true";
  }

  obj(key: string): Params | undefined {
    const v = this.raw[key];
    if (v === undefined || v === "") return undefined;
    if (typeof v !== "object" || Array.isArray(v))
      throw invalidParam(this.name(key), `Invalid object: ${this.name(key)}`);
    return new Params(v, this.name(key));
  }

  /** Arrays arrive as real arrays, or as objects keyed "0", "1"… past qs' array limit. */
  list(key: string): Params[] {
    const v: Raw = this.raw[key];
    if (v === undefined || v === "") return [];
    const entries: unknown[] = Array.isArray(v) ? v : typeof v === "object" ? Object.values(v) : [v];
    return entries.map((e, i) => {
      if (typeof e !== "object" || e === null)
        throw invalidParam(`${this.name(key)}[${i}]`, `Invalid object: ${this.name(key)}[${i}]`);
      return new Params(e as qs.ParsedQs, `${this.name(key)}[${i}]`);
    });
  }

  strings(key: string): string[] {
    const v: Raw = this.raw[key];
    if (v === undefined || v === "") return [];
    const entries: unknown[] = Array.isArray(v) ? v : typeof v === "object" ? Object.values(v) : [v];
    return entries.filter((e): e is string => typeof e === "string");
  }

  expand(): string[] {
    return this.strings("expand");
  }

  /** metadata[k]=v sets, metadata[k]= removes one key, metadata= clears (Stripe docs: "Metadata"). */
  metadata(current: Metadata = {}): Metadata {
    const v = this.raw.metadata;
    if (v === undefined) return current;
    if (v === "") return {};
    if (typeof v !== "object" || Array.isArray(v)) throw invalidParam(this.name("metadata"), "Invalid hash");
    const next: Metadata = { ...current };
    for (const [k, val] of Object.entries(v)) {
      if (typeof val !== "string") throw invalidParam(`${this.name("metadata")}[${k}]`, "Invalid string");
      if (val === "") delete next[k];
      else next[k] = val;
    }
    return next;
  }
}
