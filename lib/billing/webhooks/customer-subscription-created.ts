import { subscriptionObject } from "../objects";
import { syncSubscription } from "../sync";
import type { Handler } from "./types";

export const subscriptionCreated: Handler = async (db, event, stripe) => {
  await syncSubscription(db, stripe, subscriptionObject.parse(event.data.object), event.created);
};
