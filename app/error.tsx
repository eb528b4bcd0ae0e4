"use client";

import { useEffect } from "react";
import { Button } from "@/components/ui/button";
import { LinkButton } from "@/components/ui/link-button";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    // The message shown is deliberately generic; the details go to the server-side log instead.
    console.error(error);
  }, [error]);

  return (
    <div className="mx-auto flex w-full max-w-prose flex-1 flex-col justify-center gap-5 px-4 py-20">
      <h1 className="text-h2 font-semibold">Something went wrong</h1>
      <p className="text-lead text-bark">This page could not be shown just now. Please try again in a moment.</p>
      {error.digest ? <p className="text-small text-bark">Reference: {error.digest}</p> : null}
      <div className="flex flex-wrap gap-3">
        <Button onClick={() => reset()}>Try again</Button>
        <LinkButton href="/" variant="secondary">
          Go to the home page
        </LinkButton>
      </div>
    </div>
  );
}
