import { redirect } from "next/navigation";
import { requireArea } from "@/lib/auth/next-context";

export default async function AdminHome() {
  await requireArea("area:admin");
  redirect("/admin/people");
}
