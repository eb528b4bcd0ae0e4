import type { ReactNode } from "react";
import { PageContainer } from "@/components/layout/page-container";
import { Card } from "@/components/ui/card";

/** The narrow, centred card every sign-in style page sits in. */
export function AuthCard({
  title,
  intro,
  children,
  footer,
}: {
  title: string;
  intro?: ReactNode;
  children: ReactNode;
  footer?: ReactNode;
}) {
  return (
    <PageContainer className="flex justify-center">
      <div className="flex w-full max-w-md flex-col gap-5">
        <h1 className="text-h2 font-semibold">{title}</h1>
        {intro ? <div className="text-bark">{intro}</div> : null}
        <Card className="flex flex-col gap-5">{children}</Card>
        {footer ? <div className="flex flex-col gap-2 text-small">{footer}</div> : null}
      </div>
    </PageContainer>
  );
}
