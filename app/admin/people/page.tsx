import type { Metadata } from "next";
import Link from "next/link";
import { z } from "zod";
import { PageContainer } from "@/components/layout/page-container";
import { Card, CardTitle } from "@/components/ui/card";
import { Button } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/input";
import { TableShell, TBody, Td, Th, THead } from "@/components/ui/table";
import { requireArea } from "@/lib/auth/next-context";
import { listPeople, PEOPLE_PAGE_SIZE } from "@/lib/auth/people";
import { InviteTeacherForm, RoleForm } from "./people-forms";

export const metadata: Metadata = { title: "People" };

const Search = z.object({
  q: z.string().max(200).optional().catch(undefined),
  role: z.enum(["student", "teacher", "admin"]).optional().catch(undefined),
  page: z.coerce.number().int().min(1).catch(1).default(1),
});

export default async function PeoplePage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requireArea("area:admin");
  const search = Search.parse(await searchParams);
  const { rows, total } = await listPeople(search);
  const pages = Math.max(1, Math.ceil(total / PEOPLE_PAGE_SIZE));
  const pageHref = (page: number) => {
    const p = new URLSearchParams();
    if (search.q) p.set("q", search.q);
    if (search.role) p.set("role", search.role);
    p.set("page", String(page));
    return `/admin/people?${p}`;
  };
  return (
    <PageContainer className="flex flex-col gap-6">
      <h1 className="text-h2 font-semibold">People</h1>
      <Card>
        <CardTitle level={2}>Invite a teacher</CardTitle>
        <InviteTeacherForm />
      </Card>
      <form method="get" className="flex flex-wrap items-end gap-3" role="search">
        <div className="flex min-w-64 flex-1 flex-col gap-1.5">
          <label htmlFor="q" className="font-semibold">
            Search by name or e-mail
          </label>
          <Input id="q" name="q" type="search" defaultValue={search.q} />
        </div>
        <div className="flex flex-col gap-1.5">
          <label htmlFor="role" className="font-semibold">
            Role
          </label>
          <Select id="role" name="role" defaultValue={search.role ?? ""} className="w-auto">
            <option value="">Everyone</option>
            <option value="student">Students</option>
            <option value="teacher">Teachers</option>
            <option value="admin">Admins</option>
          </Select>
        </div>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </form>
      <TableShell caption={`${total} ${total === 1 ? "person" : "people"} · page ${search.page} of ${pages}`}>
        <THead>
          <tr>
            <Th>Name</Th>
            <Th>E-mail</Th>
            <Th>Role</Th>
            <Th>Joined</Th>
          </tr>
        </THead>
        <TBody>
          {rows.map((p) => (
            <tr key={p.id}>
              <Td className="font-semibold">{p.name}</Td>
              <Td>{p.email}</Td>
              <Td>
                <RoleForm userId={p.id} name={p.name} role={p.role} self={p.id === user.id} />
              </Td>
              <Td className="whitespace-nowrap">{p.createdAt.toISOString().slice(0, 10)}</Td>
            </tr>
          ))}
        </TBody>
      </TableShell>
      {rows.length === 0 ? <p className="text-bark">Nobody matches that search.</p> : null}
      <nav aria-label="Pages" className="flex items-center justify-between gap-3">
        {search.page > 1 ? <Link href={pageHref(search.page - 1)}>← Previous page</Link> : <span />}
        {search.page < pages ? <Link href={pageHref(search.page + 1)}>Next page →</Link> : <span />}
      </nav>
    </PageContainer>
  );
}
