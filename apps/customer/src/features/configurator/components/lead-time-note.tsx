import { useLeadTime } from '../api/lead-time';

const day = (iso: string) =>
  new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-US', { month: 'short', day: 'numeric', timeZone: 'UTC' });

/** "Could start in about N weeks", from the preview's shop hours and the board; nothing while it is unknown. */
export function LeadTimeNote({ hours }: { hours: number | undefined }) {
  const q = useLeadTime(hours);
  if (!q.data) return null;
  const { startWeek, startDate, finishDate } = q.data;
  const wait = startWeek - 1;
  return (
    <p className="mb-3 text-sm" aria-label="Lead time">
      {wait === 0
        ? 'Could start this week'
        : `Could start in about ${wait} week${wait === 1 ? '' : 's'} (from ${day(startDate)})`}
      , ready around {day(finishDate)}, as the shop’s board stands today.
    </p>
  );
}
