"use client";
// The filters above an admin table: choices (status, plan, course), a date range and a name or
// e-mail search. Applied together on submit, written to the URL by the table.
import { useId } from "react";
import { Button, buttonClasses } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/input";
import { words } from "./format";

export type FilterDef = { name: string; label: string; options: { value: string; label: string }[] };

type Props = {
  filters: FilterDef[];
  values: URLSearchParams;
  /** The page's own address: before the page hydrates, the form is sent there as a plain GET. */
  action: string;
  onApply: (change: Record<string, string | null>) => void;
};

const FIXED = ["from", "to", "q"];
const KEPT = ["sort", "dir", "pageSize"];

/** A status menu (values shown in words) and a plan menu: the filters every money table starts with. */
export function statusAndPlanFilters(
  statuses: readonly string[],
  plans: { id: string; name: string }[],
  labels = { status: "Status", plan: "Plan" },
): FilterDef[] {
  return [
    { name: "status", label: labels.status, options: statuses.map((s) => ({ value: s, label: words(s) })) },
    { name: "plan", label: labels.plan, options: plans.map((p) => ({ value: p.id, label: p.name })) },
  ];
}

export function FilterBar({ filters, values, action, onApply }: Props) {
  const id = useId();
  const names = [...filters.map((f) => f.name), ...FIXED];
  return (
    <form
      method="get"
      action={action}
      role="search"
      aria-label="Filter the table"
      className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4"
      // Remounted when the applied filters change (Clear, back button) so the fields show what is applied; a new
      // sort or page does not remount it, so a filter being chosen at that moment is not lost.
      key={names.map((n) => `${n}=${values.get(n) ?? ""}`).join("&")}
      onSubmit={(e) => {
        e.preventDefault();
        const form = new FormData(e.currentTarget);
        onApply(Object.fromEntries(names.map((n) => [n, String(form.get(n) ?? "").trim() || null])));
      }}
    >
      {/* The order shown is kept when the form is sent before the page has hydrated. */}
      {KEPT.map((k) => (values.get(k) ? <input key={k} type="hidden" name={k} value={values.get(k) ?? ""} /> : null))}
      {filters.map((f) => (
        <label key={f.name} className="flex flex-col gap-1 text-small font-semibold" htmlFor={`${id}-${f.name}`}>
          {f.label}
          <Select id={`${id}-${f.name}`} name={f.name} defaultValue={values.get(f.name) ?? ""}>
            <option value="">Any</option>
            {f.options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
              </option>
            ))}
          </Select>
        </label>
      ))}
      <label className="flex flex-col gap-1 text-small font-semibold" htmlFor={`${id}-from`}>
        From
        <Input id={`${id}-from`} name="from" type="date" defaultValue={values.get("from") ?? ""} />
      </label>
      <label className="flex flex-col gap-1 text-small font-semibold" htmlFor={`${id}-to`}>
        To
        <Input id={`${id}-to`} name="to" type="date" defaultValue={values.get("to") ?? ""} />
      </label>
      <label className="flex flex-col gap-1 text-small font-semibold" htmlFor={`${id}-q`}>
        Name or e-mail
        <Input id={`${id}-q`} name="q" type="search" maxLength={100} defaultValue={values.get("q") ?? ""} />
      </label>
      <div className="flex items-end gap-2">
        <Button type="submit">Apply filters</Button>
        <a
          className={buttonClasses("quiet")}
          href={`${action}?${new URLSearchParams(KEPT.flatMap((k) => (values.get(k) ? [[k, values.get(k) ?? ""]] : [])))}`}
          onClick={(e) => {
            e.preventDefault();
            onApply(Object.fromEntries(names.map((n) => [n, null])));
          }}
        >
          Clear
        </a>
      </div>
    </form>
  );
}
