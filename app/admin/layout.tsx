import type { ReactNode } from "react";
import { requireArea } from "@/lib/auth/next-context";

export const dynamic = "force-dynamic";

export default async function AdminLayout({ children }: { children: ReactNode }) {
  await requireArea("area:admin");
  return children;
}
