export const dayRouteKeys = {
  all: ["day-route"] as const,
  day: (date: string) => ["day-route", date] as const,
};
