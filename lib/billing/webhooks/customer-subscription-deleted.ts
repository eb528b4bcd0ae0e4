import { mailEnded } from "../notify";
import { subscriptionObject } from "../objects";
import { syncSubscription } from "../sync";
import type { Handler } from "./types";

// The membership has ended (cancelled at period end, or Stripe gave up on a failed renewal).
export const subscriptionDeleted: Handler = async (db, event, stripe) => {
  const row = await syncSubscription(db, stripe, subscriptionObject.parse(event.data.object), event.created);
  if (row?.status === "canceled") await mailEnded(db, row);
};
