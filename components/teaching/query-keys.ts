export const ASSIGNMENTS_KEY = ["teach", "assignments"] as const;
export const REVIEW_KEY = ["teach", "review"] as const;
export const ROSTER_KEY = ["teach", "roster"] as const;
