import { formatInTimeZone } from '@/lib/format/time';
import { formatMargin } from '@/lib/format/units';
import type { StatusReply } from '@/lib/series/wire';

/** The one sentence that answers "does it make it to sunrise?", in the site's local time. */
export function tonightSentence({ s }: { s: StatusReply }): { text: string; tone: 'ember' | 'hazard' | 'muted' } {
  const tz = s.node.time_zone;
  const at = (seconds: number | null) => (seconds === null ? '—' : formatInTimeZone(new Date(seconds * 1000), tz));
  const last = at(s.last_reading_at);
  const brownoutPassed = s.brownout_at !== null && s.brownout_at <= s.evaluated_at;
  switch (s.state) {
    case 'new':
      return { text: 'No reading has arrived yet: nothing to project.', tone: 'muted' };
    case 'dark':
      return {
        text: `Quiet since ${last}, ${brownoutPassed ? `past its projected brownout at ${at(s.brownout_at)}` : 'close to its burst floor'}: presumed browned out. It returns once the bank climbs back to its start voltage.`,
        tone: 'hazard',
      };
    case 'silent':
      return { text: `Quiet since ${last} while its bank was healthy: look at the link or the firmware.`, tone: 'muted' };
    default:
      break;
  }
  if (s.brownout_at !== null && brownoutPassed) {
    return { text: `Projected to brown out at ${at(s.brownout_at)}, and no report has come since ${last}.`, tone: 'hazard' };
  }
  const measured = s.draw_scale > 1 ? ` Projected with the draw measured last night, ${s.draw_scale.toFixed(2)}× what its settings predict.` : '';
  if (s.charging && s.charging_until === null) return { text: 'Charging: the sun does not set within seven days (polar day), so there is no night to carry.', tone: 'ember' };
  // By day the bank is charging: tonight is counted from dusk with the bank as it is now.
  const fromDusk = s.charging && s.charging_until !== null ? `Charging now. From dusk at ${at(s.charging_until)}, with the bank as it is now: ` : '';
  const say = (text: string) => (fromDusk ? fromDusk + text.charAt(0).toLowerCase() + text.slice(1) : text);
  if (s.brownout_at !== null) {
    const early = s.recharge_at !== null ? ` — ${spanWords(s.recharge_at - s.brownout_at)} before the recharge at ${at(s.recharge_at)}` : '';
    return { text: say(`Projected to brown out at ${at(s.brownout_at)}${early}.${measured}`), tone: 'hazard' };
  }
  if (s.recharge_at === null) return { text: say('No recharge within seven days (polar night): the margin covers the week ahead.'), tone: 'muted' };
  return { text: say(`Reaches the recharge at ${at(s.recharge_at)} with ${formatMargin(s.margin)} the energy it needs.${measured}`), tone: 'ember' };
}

export function spanWords(seconds: number): string {
  const minutes = Math.max(0, Math.round(seconds / 60));
  if (minutes < 60) return `${minutes} min`;
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return m ? `${h} h ${m} min` : `${h} h`;
}
