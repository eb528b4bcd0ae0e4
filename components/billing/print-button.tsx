"use client";
import { Button } from "@/components/ui/button";

export function PrintButton() {
  return (
    <div className="print:hidden">
      <Button variant="secondary" onClick={() => window.print()}>
        Print this receipt
      </Button>
    </div>
  );
}
