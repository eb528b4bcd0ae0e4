import { subscriptionObject } from "../objects";
import { syncSubscription } from "../sync";
import type { Handler } from "./types";

// Renewals, plan changes, cancel at period end and resume, past due: all arrive as an update.
export const subscriptionUpdated: Handler = async (db, event, stripe) => {
  await syncSubscription(db, stripe, subscriptionObject.parse(event.data.object), event.created);
};
