import { Card } from "@/components/ui/card";
import { frameDocument, linksIn, type CapturedEmail } from "@/lib/mail/captured";

/** One captured message: its envelope, its links as plain links, the HTML in a sandbox and the text part. */
export function CapturedMessage({ email }: { email: CapturedEmail }) {
  const links = email.html ? linksIn(email.html) : [];
  return (
    <Card as="article" aria-labelledby="message-subject" className="flex flex-col gap-4">
      <header>
        <h2 id="message-subject" className="text-h3 font-semibold">
          {email.subject}
        </h2>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-small text-bark">
          <dt>From</dt>
          <dd>{email.from}</dd>
          <dt>To</dt>
          <dd>{email.to.join(", ")}</dd>
          <dt>Sent</dt>
          <dd>
            <time dateTime={email.created_at}>{new Date(email.created_at).toLocaleString("en-GB")}</time>
          </dd>
        </dl>
      </header>
      {links.length > 0 && (
        <section aria-labelledby="message-links">
          <h3 id="message-links" className="font-semibold">
            Links in this message
          </h3>
          <ul className="mt-1 flex flex-col gap-1 break-all">
            {links.map((href) => (
              <li key={href}>
                <a href={href}>{href}</a>
              </li>
            ))}
          </ul>
        </section>
      )}
      {email.html && (
        // No scripts, no same-origin access: a message is shown, never run. Popups let its links open in a tab.
        <iframe
          title={`The message "${email.subject}" as the reader sees it`}
          sandbox="allow-popups allow-popups-to-escape-sandbox"
          srcDoc={frameDocument(email.html)}
          className="h-[36rem] w-full rounded-knot border border-line bg-white"
        />
      )}
      {email.text && (
        <details>
          <summary className="cursor-pointer font-semibold">Plain-text part</summary>
          <pre className="mt-2 overflow-x-auto text-small whitespace-pre-wrap">{email.text}</pre>
        </details>
      )}
    </Card>
  );
}
