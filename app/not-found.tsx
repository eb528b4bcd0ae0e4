import Link from "next/link";

export const metadata = { title: "Page not found" };

export default function NotFound() {
  return (
    <div className="mx-auto flex w-full max-w-prose flex-1 flex-col justify-center gap-5 px-4 py-20">
      <p className="font-semibold tracking-widest text-cedar uppercase">404</p>
      <h1 className="text-h2 font-semibold">We could not find that page</h1>
      <p className="text-lead text-bark">
        The address may be mistyped, or the page may have moved. The catalogue is a good place to pick up the thread.
      </p>
      <p className="flex flex-wrap gap-x-6 gap-y-2">
        <Link href="/">Back to the home page</Link>
        <Link href="/catalogue">Browse the catalogue</Link>
      </p>
    </div>
  );
}
