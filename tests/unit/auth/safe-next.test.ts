import { describe, expect, it } from "vitest";
import { safeNext } from "@/lib/auth/links";

const APP = "http://127.0.0.1:3000";

// Open redirects: OWASP "Unvalidated Redirects and Forwards Cheat Sheet". Browsers strip tab and
// newline from a URL and read "\" as "/" (WHATWG URL Standard §4.4, "special" schemes), so "/<tab>/host"
// and "/\host" leave the site; a newline in a Location header is a 500 or header injection.
describe("return addresses after sign-in", () => {
  it("keeps paths on this site", () => {
    expect(safeNext("/teach/invite?x=1", APP)).toBe("/teach/invite?x=1");
    expect(safeNext("/learn", APP)).toBe("/learn");
    expect(safeNext("/learn/practice#today", APP)).toBe("/learn/practice#today");
    expect(safeNext("/learn/../admin/people", APP)).toBe("/admin/people"); // normalised, still here
    expect(safeNext("/learn/tunes/Sí", APP)).toBe("/learn/tunes/S%C3%AD");
  });

  const family = [
    // Another host outright.
    "//evil.example",
    "///evil.example",
    "//evil.example/learn",
    "https://evil.example",
    "http://127.0.0.1:3000.evil.example/",
    "HTTPS://evil.example",
    "javascript:alert(1)",
    "JaVaScRiPt:alert(document.cookie)",
    "data:text/html,<script>alert(1)</script>",
    // Backslashes, which browsers read as slashes.
    "/\\evil.example",
    "\\\\evil.example",
    "\\/evil.example",
    "/\\/evil.example",
    // Control characters a browser strips, leaving "//".
    "/\t/evil.example",
    "/\n/evil.example",
    "/\r\n/evil.example",
    "/\u0000/evil.example",
    "/learn\u007f",
    "/learn\nSet-Cookie: x=1",
    // Encoded forms of the same.
    "/%09/evil.example",
    "/%0a/evil.example",
    "/%0D%0ALocation:%20https://evil.example",
    "/%5Cevil.example",
    "/%2F%2Fevil.example",
    "%2F%2Fevil.example",
    "/%2f/evil.example",
    "/%E0%A4%A", // malformed escape
    // A path that normalises to "//host".
    "/.//evil.example",
    "/learn/..//evil.example",
    // Not a path at all, or an absolute address of this very site (only paths are accepted).
    "evil.example",
    " /learn",
    "http://127.0.0.1:3000/learn",
    "",
    "/" + "a".repeat(3000),
  ];
  for (const bad of family) {
    it(`refuses ${JSON.stringify(bad.slice(0, 60))}`, () => {
      expect(safeNext(bad, APP)).toBeNull();
    });
  }

  it("refuses nothing-at-all", () => {
    expect(safeNext(undefined, APP)).toBeNull();
    expect(safeNext(null, APP)).toBeNull();
  });
});
