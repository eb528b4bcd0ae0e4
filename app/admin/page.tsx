import type { Metadata } from "next";
import Link from "next/link";
import { PageContainer } from "@/components/layout/page-container";
import { Card, CardTitle } from "@/components/ui/card";
import { requireArea } from "@/lib/auth/next-context";

export const metadata: Metadata = { title: "School admin" };

const PLACES = [
  { href: "/admin/people", title: "People", text: "Students, teachers and admins; invite a teacher." },
  { href: "/admin/plans", title: "Plans", text: "Membership plans and their prices." },
  { href: "/admin/payments", title: "Payments", text: "Every payment; refunds; CSV export." },
  { href: "/admin/memberships", title: "Memberships", text: "Who is a member, on which plan, until when." },
  { href: "/admin/enrolments", title: "Enrolments", text: "Who is on which course, with their membership." },
  { href: "/admin/revenue", title: "Revenue", text: "New, renewals and refunds by month." },
];

export default async function AdminHome() {
  await requireArea("area:admin");
  return (
    <PageContainer className="flex flex-col gap-6">
      <h1 className="text-h2 font-semibold">School admin</h1>
      <ul className="grid grid-cols-1 gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {PLACES.map((p) => (
          <li key={p.href}>
            <Card className="h-full">
              <CardTitle level={2}>
                <Link href={p.href} className="underline-offset-2 hover:underline">
                  {p.title}
                </Link>
              </CardTitle>
              <p className="text-bark">{p.text}</p>
            </Card>
          </li>
        ))}
      </ul>
    </PageContainer>
  );
}
