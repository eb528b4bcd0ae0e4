import { z } from "zod";
import { guardRoute } from "@/lib/auth/guard";
import { listPeople, PEOPLE_PAGE_SIZE } from "@/lib/auth/people";

export const dynamic = "force-dynamic";

/** Admin's people list: search by name or address, filter by role, one page at a time. */
export const GET = guardRoute(
  {
    action: "people:list",
    input: z.object({
      q: z.string().max(200).optional(),
      role: z.enum(["student", "teacher", "admin"]).optional(),
      page: z.coerce.number().int().min(1).default(1),
    }),
  },
  async (_ctx, input) => {
    const { rows, total } = await listPeople(input);
    return Response.json(
      { rows, total, page: input.page, pageSize: PEOPLE_PAGE_SIZE },
      { headers: { "cache-control": "no-store" } },
    );
  },
);
