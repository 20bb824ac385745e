"use client";

import { ReviewPanel } from "@/components/review/review-panel";
import { useDieWorkspace } from "../die-workspace-context";

/** The die's remarks, check status and activity. */
export function ReviewTab() {
  const { die, userId, review, state, api, shownTransform } = useDieWorkspace();
  return <ReviewPanel die={die} userId={userId} review={review} state={state} api={api} transform={shownTransform} />;
}
