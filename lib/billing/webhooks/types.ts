import type { Tx as Db } from "@/db/queries/auth";
import type { Stripe } from "../stripe";

/** What a handler reads of an event: its time (unix seconds, Stripe's clock) and the object as sent. */
export interface EventIn {
  id: string;
  type: string;
  created: number;
  data: { object: unknown };
}

/** One small handler per event type; it runs in the transaction that stores the event id. */
export type Handler = (db: Db, event: EventIn, stripe: Stripe) => Promise<void>;
