import { z } from "zod";

// What the local Resend stand-in (scripts/fakes/resend.ts) answers on /_fake/emails, checked at the edge.
const capturedEmail = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  html: z.string().nullable(),
  text: z.string().nullable(),
  created_at: z.string(),
});
export type CapturedEmail = z.infer<typeof capturedEmail>;

export async function listCapturedEmails(fakeUrl: string): Promise<CapturedEmail[]> {
  const res = await fetch(new URL("/_fake/emails", fakeUrl), { cache: "no-store" });
  if (!res.ok) throw new Error(`the stand-in answered ${res.status}`);
  return z.object({ data: z.array(capturedEmail) }).parse(await res.json()).data;
}

/** Every distinct web address a message links to, in order, so the page can offer them as plain links. */
export function linksIn(html: string): string[] {
  const found = [...html.matchAll(/href="(https?:\/\/[^"]+)"/g)].map((m) => decodeEntities(m[1] ?? ""));
  return [...new Set(found)];
}

function decodeEntities(value: string): string {
  return value
    .replace(/&amp;/g, "&")
    .replace(/&quot;/g, '"')
    .replace(/&#x27;|&#39;/g, "'")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">");
}

/**
 * The message as the iframe's document. Links open in a new tab: inside the sandbox they would load
 * the app within the frame.
 */
export function frameDocument(html: string): string {
  const base = '<base target="_blank">';
  return /<head[^>]*>/i.test(html) ? html.replace(/<head([^>]*)>/i, `<head$1>${base}`) : `${base}${html}`;
}
