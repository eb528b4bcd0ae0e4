import type { ReactNode } from "react";
import { requireArea } from "@/lib/auth/next-context";

export const dynamic = "force-dynamic";

export default async function LearnLayout({ children }: { children: ReactNode }) {
  await requireArea("area:learn");
  return children;
}
