"use client";
import { useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Input, Select } from "@/components/ui/input";
import { ApiError, fetchJson } from "@/lib/catalogue/fetch-json";

export type PlanValues = { name: string; amount: number; currency: string; interval: "month" | "year"; opens: string };

/** Create (POST) or edit (PATCH) a plan; the server's field errors appear under their fields. */
export function PlanForm({
  initial,
  submitLabel,
  url,
  method,
  onDone,
}: {
  initial?: PlanValues;
  submitLabel: string;
  url: string;
  method: "POST" | "PATCH";
  onDone: () => void;
}) {
  const [v, setV] = useState<PlanValues>(
    initial ?? { name: "", amount: 1800, currency: "GBP", interval: "month", opens: "The whole catalogue" },
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const id = (f: string) => `${method.toLowerCase()}-${initial?.name ?? "new"}-${f}`.replace(/\s+/g, "-");
  async function submit(e: FormEvent) {
    e.preventDefault();
    setBusy(true);
    setErrors({});
    setMessage(null);
    try {
      await fetchJson(url, { method, body: v });
      onDone();
      if (!initial) setV({ ...v, name: "" });
    } catch (err) {
      setErrors(err instanceof ApiError ? err.fieldErrors : {});
      setMessage(err instanceof Error ? err.message : "Something went wrong.");
    } finally {
      setBusy(false);
    }
  }
  return (
    <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" noValidate>
      <Field id={id("name")} label="Name" error={errors.name}>
        {(c) => <Input {...c} value={v.name} onChange={(e) => setV({ ...v, name: e.target.value })} />}
      </Field>
      <Field id={id("amount")} label="Price in minor units" hint="Pence or cents: 1800 is £18.00" error={errors.amount}>
        {(c) => (
          <Input
            {...c}
            inputMode="numeric"
            value={String(v.amount)}
            onChange={(e) => setV({ ...v, amount: Number(e.target.value) })}
          />
        )}
      </Field>
      <Field id={id("currency")} label="Currency" error={errors.currency}>
        {(c) => (
          <Select {...c} value={v.currency} onChange={(e) => setV({ ...v, currency: e.target.value })}>
            <option value="GBP">GBP</option>
            <option value="EUR">EUR</option>
            <option value="USD">USD</option>
          </Select>
        )}
      </Field>
      <Field id={id("interval")} label="Billed every" error={errors.interval}>
        {(c) => (
          <Select
            {...c}
            value={v.interval}
            onChange={(e) => setV({ ...v, interval: e.target.value === "year" ? "year" : "month" })}
          >
            <option value="month">month</option>
            <option value="year">year</option>
          </Select>
        )}
      </Field>
      <div className="sm:col-span-2">
        <Field id={id("opens")} label="What it opens" error={errors.opens}>
          {(c) => <Input {...c} value={v.opens} onChange={(e) => setV({ ...v, opens: e.target.value })} />}
        </Field>
      </div>
      <div className="flex flex-col gap-2 sm:col-span-2">
        {message ? (
          <p role="alert" className="font-semibold text-berry">
            {message}
          </p>
        ) : null}
        <div>
          <Button type="submit" needsScript disabled={busy}>
            {busy ? "Saving…" : submitLabel}
          </Button>
        </div>
      </div>
    </form>
  );
}
