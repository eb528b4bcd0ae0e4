import { controlClasses } from "@/components/ui/input";

/** The form controls' look without their full width, for selects and inputs that sit in a row. */
export const inlineControl = controlClasses.replace("w-full", "w-auto");
