"use client";
// The private calendar address: copy it into a calendar program, get a new one (the old one stops
// working), or turn the feed off.
import { useId, useState } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Card, CardTitle } from "@/components/ui/card";
import { Input } from "@/components/ui/input";
import { errorWords, fetchJson } from "@/lib/catalogue/fetch-json";

type Notice = { tone: "success" | "error"; text: string } | null;

export function CalendarFeedCard({
  initialUrl,
  audience,
}: {
  initialUrl: string | null;
  audience: "student" | "teacher";
}) {
  const inputId = useId();
  const [url, setUrl] = useState(initialUrl);
  const [busy, setBusy] = useState(false);
  const [notice, setNotice] = useState<Notice>(null);

  async function run(what: "rotate" | "off") {
    setBusy(true);
    setNotice(null);
    try {
      if (what === "off") {
        await fetchJson("/api/calendar", { method: "DELETE" });
        setUrl(null);
        setNotice({
          tone: "success",
          text: "The calendar feed is off. Calendars subscribed to it will stop updating.",
        });
      } else {
        const next = await fetchJson<{ url: string }>("/api/calendar", { method: "POST" });
        setNotice({
          tone: "success",
          text: url
            ? "New address made. The old one no longer works; subscribe again with this one."
            : "Your calendar address is ready.",
        });
        setUrl(next.url);
      }
    } catch (e) {
      setNotice({ tone: "error", text: errorWords(e) });
    } finally {
      setBusy(false);
    }
  }

  async function copy() {
    if (!url) return;
    try {
      await navigator.clipboard.writeText(url);
      setNotice({ tone: "success", text: "Address copied." });
    } catch {
      setNotice({ tone: "error", text: "Copying was not allowed here; select the address and copy it yourself." });
    }
  }

  const what = audience === "student" ? "your assignments' due dates" : "the due dates of the assignments you gave";
  return (
    <Card as="section" aria-labelledby={`${inputId}-title`} className="flex flex-col gap-4">
      <CardTitle level={2}>
        <span id={`${inputId}-title`}>Calendar feed</span>
      </CardTitle>
      <p className="max-w-prose text-bark">
        Subscribe to this address in your calendar program to see {what}. It updates on its own. Anyone who has the
        address can see those dates, so keep it to yourself; if it got out, make a new one.
      </p>
      {url ? (
        <div className="flex flex-col gap-2">
          <label htmlFor={inputId} className="font-semibold text-ink">
            Your calendar address
          </label>
          <div className="flex flex-col gap-2 sm:flex-row">
            <Input
              id={inputId}
              readOnly
              value={url}
              onFocus={(e) => e.currentTarget.select()}
              className="font-mono text-small"
            />
            <Button variant="secondary" onClick={() => void copy()}>
              Copy
            </Button>
          </div>
        </div>
      ) : (
        <p className="font-semibold text-ink">The calendar feed is off.</p>
      )}
      <div className="flex flex-wrap gap-3">
        <Button onClick={() => void run("rotate")} disabled={busy}>
          {url ? "New address" : "Turn on"}
        </Button>
        {url ? (
          <Button variant="quiet" onClick={() => void run("off")} disabled={busy}>
            Turn off
          </Button>
        ) : null}
      </div>
      {notice ? (
        <Alert tone={notice.tone} live>
          {notice.text}
        </Alert>
      ) : null}
    </Card>
  );
}
