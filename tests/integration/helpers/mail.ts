import { startWorker, type RetryPolicy, type RunningWorker } from "@/lib/jobs/worker";
import { createMailer } from "@/lib/mail/send";
import { startResendFake, type ResendFake } from "@/scripts/fakes/resend";

export const FAKE_KEY = "re_test_integration";

export function testMailer(fakeUrl: string, from = "Rosinwood <hello@rosinwood.test>") {
  return createMailer({
    apiKey: FAKE_KEY,
    baseUrl: fakeUrl,
    from,
    appUrl: "http://127.0.0.1:3000",
    schoolName: "Test Fiddle School",
  });
}

/** The Resend stand-in on a free port, and the real worker sending to it from this process. */
export async function startMailWorld(
  databaseUrl: string,
  options: { failRate: number; retry: RetryPolicy },
): Promise<{ fake: ResendFake; worker: RunningWorker; stop: () => Promise<void> }> {
  const fake = await startResendFake({ port: 0, failRate: options.failRate, apiKey: FAKE_KEY });
  const mailer = testMailer(fake.url);
  const worker = await startWorker({
    databaseUrl,
    mailer,
    concurrency: 8,
    pollingIntervalSeconds: 0.5,
    retry: options.retry,
    // Tests call sweepNow() themselves; a timed sweep would only add stray attempts.
    sweep: { intervalSeconds: 3600, minAgeSeconds: 3600 },
    log: () => {},
  });
  return {
    fake,
    worker,
    stop: async () => {
      await worker.stop();
      await fake.close();
    },
  };
}

export async function waitFor(check: () => Promise<boolean> | boolean, timeoutMs: number, what: string): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > until) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
