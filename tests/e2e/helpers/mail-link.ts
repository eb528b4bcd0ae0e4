// Reads e-mailed links back from the local Resend stand-in (scripts/fakes/resend.ts), the way a
// person trying the demo would open them from its page.

type FakeEmail = { to: string[]; subject: string; text: string | null; html: string | null; created_at: string };

export async function mailedLink(
  to: string,
  path: string,
  opts: { after?: number; timeoutMs?: number } = {},
): Promise<string> {
  const base = process.env.RESEND_FAKE_URL;
  if (!base) throw new Error("RESEND_FAKE_URL is not set: the Resend stand-in is not running under this test command");
  const deadline = Date.now() + (opts.timeoutMs ?? 45_000);
  // The link is the first http(s) address with this path and a token; html may escape & as &amp;.
  const pattern = new RegExp(`https?://[^\\s"'<>]+${path.replace(/[/-]/g, "\\$&")}\\?token=[A-Za-z0-9_-]+`);
  for (;;) {
    const res = await fetch(`${base}/_fake/emails`);
    const { data } = (await res.json()) as { data: FakeEmail[] };
    const mail = data.find(
      (m) =>
        m.to.some((a) => a.toLowerCase() === to.toLowerCase()) &&
        Date.parse(m.created_at) >= (opts.after ?? 0) &&
        pattern.test(m.text ?? m.html ?? ""),
    );
    if (mail) return pattern.exec(mail.text ?? mail.html ?? "")![0];
    if (Date.now() > deadline) throw new Error(`no mail to ${to} with a ${path} link arrived in time`);
    await new Promise((r) => setTimeout(r, 300));
  }
}
