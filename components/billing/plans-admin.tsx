"use client";
import { useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { formatMoney } from "@/lib/billing/money";
import type { PlanJson } from "@/lib/billing/plans";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";
import { PlanForm } from "./plan-form";

export function PlansAdmin() {
  const client = useQueryClient();
  const list = useQuery({
    queryKey: ["admin-plans"],
    queryFn: () => fetchJson<{ plans: PlanJson[] }>("/api/admin/plans"),
  });
  const [editing, setEditing] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const refresh = () => client.invalidateQueries({ queryKey: ["admin-plans"] });
  async function act(url: string, method: "POST" | "DELETE", body?: unknown) {
    setError(null);
    try {
      await fetchJson(url, { method, body });
      await refresh();
    } catch (e) {
      setError(errorWords(e));
    }
  }
  return (
    <div className="flex flex-col gap-6">
      {error ? (
        <Alert tone="error" live>
          {error}
        </Alert>
      ) : null}
      {list.isPending ? (
        <p role="status">Loading plans…</p>
      ) : list.isError ? (
        <Alert tone="error">{errorWords(list.error)}</Alert>
      ) : null}
      <ul className="flex flex-col gap-4">
        {list.data?.plans.map((p) => (
          <Card as="li" key={p.id} className="flex flex-col gap-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h2 className="font-serif text-h4 font-semibold">{p.name}</h2>
              <p>
                {`${formatMoney(p.amount, p.currency)} per ${p.interval}`}
                {p.retiredAt ? " · retired" : ""}
              </p>
            </div>
            <p className="text-small text-bark">{`Opens: ${p.opens} · Stripe ${p.stripeProductId ?? "—"} / ${p.stripePriceId ?? "—"}`}</p>
            {editing === p.id ? (
              <PlanForm
                initial={{ name: p.name, amount: p.amount, currency: p.currency, interval: p.interval, opens: p.opens }}
                submitLabel="Save changes"
                url={`/api/admin/plans/${p.id}`}
                method="PATCH"
                onDone={() => {
                  setEditing(null);
                  void refresh();
                }}
              />
            ) : null}
            <div className="flex flex-wrap gap-2">
              <Button variant="secondary" size="sm" onClick={() => setEditing(editing === p.id ? null : p.id)}>
                {editing === p.id ? "Close" : `Edit ${p.name}`}
              </Button>
              {!p.retiredAt ? (
                <Button
                  variant="secondary"
                  size="sm"
                  onClick={() => act(`/api/admin/plans/${p.id}`, "POST", { action: "retire" })}
                >{`Retire ${p.name}`}</Button>
              ) : null}
              <Button
                variant="danger"
                size="sm"
                onClick={() => act(`/api/admin/plans/${p.id}`, "DELETE")}
              >{`Delete ${p.name}`}</Button>
            </div>
          </Card>
        ))}
      </ul>
      <Card as="section" aria-labelledby="new-plan" className="flex flex-col gap-3">
        <h2 id="new-plan" className="font-serif text-h3 font-semibold">
          New plan
        </h2>
        <PlanForm submitLabel="Create plan" url="/api/admin/plans" method="POST" onDone={() => void refresh()} />
      </Card>
    </div>
  );
}
