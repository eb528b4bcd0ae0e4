/**
 * The X-Forwarded-For a web process hands to the app: what arrived, then the socket's address (an
 * IPv4 client as plain IPv4, not "::ffff:"-mapped). Node joins repeated headers with ", ".
 * @param {string | string[] | undefined} forwarded
 * @param {string | undefined} peer
 * @returns {string}
 */
export function withPeer(forwarded, peer) {
  const address = (peer ?? "unknown").replace(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/, "$1");
  const before = (Array.isArray(forwarded) ? forwarded.join(", ") : (forwarded ?? "")).trim();
  return before ? `${before}, ${address}` : address;
}
