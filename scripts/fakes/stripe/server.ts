// Placeholder until the Stripe stand-in lands (issue 7): answers its health check only.
import { createServer } from "node:http";
const port = Number(process.env.STRIPE_FAKE_PORT ?? 4020);
createServer((req, res) => {
  res.writeHead(req.url === "/_fake/health" ? 200 : 404, { "content-type": "application/json" });
  res.end(JSON.stringify({ ok: req.url === "/_fake/health" }));
}).listen(port, "127.0.0.1", () => console.log(`Stripe stand-in on http://127.0.0.1:${port}`));
