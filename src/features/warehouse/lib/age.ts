/** How long an order has waited, in the unit a picker reads at a glance: "25 min", "3 h", "2 d". */
export function orderAge(createdAt: string, now: number = Date.now()): string {
  const created = Date.parse(createdAt);
  if (Number.isNaN(created)) return '—';
  const minutes = Math.max(0, Math.floor((now - created) / 60_000));
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${hours} h`;
  return `${Math.floor(hours / 24)} d`;
}
