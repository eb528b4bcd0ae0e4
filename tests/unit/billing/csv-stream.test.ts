import { describe, expect, it } from "vitest";
import { csvResponse, type CsvColumn } from "@/lib/billing/admin/csv";

type Row = { id: string; name: string };
const COLUMNS: CsvColumn<Row>[] = [
  { header: "Id", value: (r) => r.id },
  { header: "Name", value: (r) => r.name },
];

/** Rows, then the database failing part way (a lost connection, a statement cancelled). */
async function* failingAfter(n: number): AsyncGenerator<Row> {
  for (let i = 0; i < n; i++) yield { id: `p${i}`, name: `Person ${i}` };
  throw new Error("connection terminated unexpectedly");
}

/** Reads the whole body, or the error that ends it; never waits more than `ms`. */
async function readAll(res: Response, ms = 5000): Promise<{ text: string; error: unknown }> {
  const reader = res.body!.getReader();
  const decoder = new TextDecoder();
  let text = "";
  const deadline = new Promise<never>((_, reject) => setTimeout(() => reject(new Error("the answer never ended")), ms));
  try {
    for (;;) {
      const { done, value } = await Promise.race([reader.read(), deadline]);
      if (done) return { text, error: null };
      text += decoder.decode(value);
    }
  } catch (error) {
    if (error instanceof Error && error.message === "the answer never ended") throw error;
    return { text, error };
  }
}

describe("a streamed CSV export", () => {
  it("ends the answer with an error when the database fails part way, instead of hanging", async () => {
    const res = await csvResponse("x.csv", failingAfter(3), COLUMNS);
    expect(res.status).toBe(200);
    const { text, error } = await readAll(res);
    expect(text).toContain("p2,Person 2");
    expect(error).toBeTruthy();
  });

  it("answers the failure itself when the very first batch fails (nothing sent yet)", async () => {
    await expect(csvResponse("x.csv", failingAfter(0), COLUMNS)).rejects.toThrow(/connection terminated/);
  });

  it("streams every row with the header when nothing fails (RFC 4180: CRLF)", async () => {
    async function* three() {
      for (let i = 0; i < 3; i++) yield { id: `p${i}`, name: i === 1 ? 'Quote "me", please' : `P${i}` };
    }
    const { text, error } = await readAll(await csvResponse("x.csv", three(), COLUMNS));
    expect(error).toBeNull();
    expect(text).toBe('Id,Name\r\np0,P0\r\np1,"Quote ""me"", please"\r\np2,P2\r\n');
  });
});
