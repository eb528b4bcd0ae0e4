"use client";
// Refund one payment (issue 7 item 6): full or partial, with a reason, showing what is left to
// refund. The server checks again (and Stripe refuses more than was paid); its words are shown.
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useEffect, useId, useRef, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Input, Textarea } from "@/components/ui/input";
import { ApiError, fetchJson } from "@/lib/catalogue/fetch-json";
import { money, parseMajor, toMajor } from "./format";
import type { PaymentJson } from "./types";

export function RefundDialog({ payment, onClose }: { payment: PaymentJson; onClose: () => void }) {
  const id = useId();
  const ref = useRef<HTMLDialogElement>(null);
  const queries = useQueryClient();
  const remaining = payment.amount - payment.refundedAmount;
  const [amount, setAmount] = useState(toMajor(remaining, payment.currency));
  const [reason, setReason] = useState("");
  const [local, setLocal] = useState<Record<string, string>>({});

  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) d.showModal();
  }, []);

  // 202: Stripe refunded but the payment here is brought up to date a little later; say so, stay open.
  const [pending, setPending] = useState<string | null>(null);
  const refund = useMutation({
    mutationFn: (body: { amount: number; reason: string }) =>
      fetchJson<{ pending?: boolean; message?: string }>(`/api/admin/payments/${payment.id}/refunds`, {
        method: "POST",
        body,
      }),
    onSuccess: async (answer) => {
      await queries.invalidateQueries({ queryKey: ["admin-table"] });
      if (answer?.pending) setPending(answer.message ?? "Stripe has refunded it; it will show here shortly.");
      else onClose();
    },
  });
  const server = refund.error instanceof ApiError ? refund.error.fieldErrors : {};
  const errors = { ...server, ...local };

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const minor = parseMajor(amount, payment.currency);
    const next: Record<string, string> = {};
    if (minor === null || minor <= 0) next.amount = "Give an amount above zero, e.g. 9.00.";
    else if (minor > remaining) next.amount = `At most ${money(remaining, payment.currency)} is left to refund.`;
    if (!reason.trim()) next.reason = "Say why the payment is refunded.";
    setLocal(next);
    if (Object.keys(next).length === 0 && minor !== null) refund.mutate({ amount: minor, reason: reason.trim() });
  }

  return (
    <dialog
      ref={ref}
      aria-labelledby={`${id}-title`}
      onClose={onClose}
      className="w-[min(28rem,calc(100vw-2rem))] rounded-knot border border-line bg-paper p-0 text-ink backdrop:bg-walnut/40"
    >
      <form onSubmit={submit} className="flex flex-col gap-4 p-5" noValidate>
        <h2 id={`${id}-title`} className="font-serif text-h4">
          Refund {payment.name}
        </h2>
        <p className="text-small text-bark">
          Paid {money(payment.amount, payment.currency)}
          {payment.refundedAmount > 0
            ? `, ${money(payment.refundedAmount, payment.currency)} refunded already`
            : ""}.{" "}
          <strong className="text-ink" data-testid="refundable">
            Refundable: {money(remaining, payment.currency)}
          </strong>
        </p>
        <label htmlFor={`${id}-amount`} className="flex flex-col gap-1 font-semibold">
          Amount to refund ({payment.currency})
          <Input
            id={`${id}-amount`}
            inputMode="decimal"
            value={amount}
            onChange={(e) => setAmount(e.target.value)}
            aria-invalid={errors.amount ? true : undefined}
            aria-describedby={errors.amount ? `${id}-amount-error` : undefined}
          />
        </label>
        {errors.amount ? (
          <p id={`${id}-amount-error`} className="text-small text-berry">
            {errors.amount}
          </p>
        ) : null}
        <label htmlFor={`${id}-reason`} className="flex flex-col gap-1 font-semibold">
          Reason
          <Textarea
            id={`${id}-reason`}
            rows={3}
            maxLength={500}
            value={reason}
            onChange={(e) => setReason(e.target.value)}
            aria-invalid={errors.reason ? true : undefined}
            aria-describedby={errors.reason ? `${id}-reason-error` : undefined}
          />
        </label>
        {errors.reason ? (
          <p id={`${id}-reason-error`} className="text-small text-berry">
            {errors.reason}
          </p>
        ) : null}
        {refund.error && !errors.amount && !errors.reason ? <Alert tone="error">{refund.error.message}</Alert> : null}
        {pending ? <Alert tone="success">{pending}</Alert> : null}
        <div className="flex flex-wrap justify-end gap-2">
          <Button variant="quiet" onClick={onClose}>
            Cancel
          </Button>
          <Button type="submit" needsScript variant="danger" disabled={refund.isPending || pending !== null}>
            {refund.isPending ? "Refunding…" : "Refund"}
          </Button>
        </div>
      </form>
    </dialog>
  );
}
