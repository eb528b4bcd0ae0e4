/** See peer-address.mjs (plain JavaScript, since serve-worker.mjs runs without a compiler). */
export function withPeer(forwarded: string | string[] | undefined, peer: string | undefined): string;
