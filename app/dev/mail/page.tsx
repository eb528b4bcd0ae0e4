import Link from "next/link";
import { notFound } from "next/navigation";
import { PageContainer } from "@/components/layout/page-container";
import { CapturedMessage } from "@/components/mail/captured-message";
import { Alert } from "@/components/ui/alert";
import { TBody, THead, TableShell, Td, Th } from "@/components/ui/table";
import { env } from "@/lib/env";
import { listCapturedEmails, type CapturedEmail } from "@/lib/mail/captured";

export const dynamic = "force-dynamic";
export function generateMetadata() {
  return { title: env().RESEND_FAKE_URL ? "Captured e-mail" : "Page not found", robots: { index: false } };
}

// Present only while the local Resend stand-in is configured (npm start, npm test): a real deployment has no such page.
export default async function CapturedMailPage({
  searchParams,
}: {
  searchParams: Promise<{ id?: string | string[] }>;
}) {
  const fakeUrl = env().RESEND_FAKE_URL;
  if (!fakeUrl) notFound();
  const { id } = await searchParams;
  let emails: CapturedEmail[] | null = null;
  try {
    emails = await listCapturedEmails(fakeUrl);
  } catch {
    emails = null;
  }
  const selected = emails?.find((e) => e.id === id) ?? emails?.[0];

  return (
    <PageContainer className="flex flex-col gap-6">
      <header className="flex flex-col gap-2">
        <h1 className="text-h2 font-semibold">Captured e-mail</h1>
        <p className="max-w-prose text-bark">
          This copy of Rosinwood sends its e-mail to a local stand-in, so nothing leaves this machine. Every message it
          sends appears here, newest first, with its links ready to open.
        </p>
      </header>
      {emails === null ? (
        <Alert tone="error" title="The stand-in does not answer">
          Rosinwood expected the local mail stand-in at {fakeUrl}. Is it still running?
        </Alert>
      ) : emails.length === 0 ? (
        <Alert>No e-mail yet. Sign up, ask for a password reset or send an invitation, then come back.</Alert>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
          <TableShell className="self-start" caption={`${emails.length} message${emails.length === 1 ? "" : "s"}`}>
            <THead>
              <tr>
                <Th>To</Th>
                <Th>Subject</Th>
                <Th>Time</Th>
              </tr>
            </THead>
            <TBody>
              {emails.map((email) => (
                <tr key={email.id} className={email.id === selected?.id ? "bg-rosin-tint" : undefined}>
                  <Td className="break-all">{email.to.join(", ")}</Td>
                  <Td>
                    <Link
                      href={`/dev/mail?id=${email.id}`}
                      aria-current={email.id === selected?.id ? "true" : undefined}
                    >
                      {email.subject}
                    </Link>
                  </Td>
                  <Td className="whitespace-nowrap">
                    <time dateTime={email.created_at}>{new Date(email.created_at).toLocaleTimeString("en-GB")}</time>
                  </Td>
                </tr>
              ))}
            </TBody>
          </TableShell>
          {selected && <CapturedMessage email={selected} />}
        </div>
      )}
    </PageContainer>
  );
}
