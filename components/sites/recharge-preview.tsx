'use client';

import { useEffect, useState } from 'react';
import { dischargeWindow } from '@/lib/energy';
import { formatInTimeZone, TIME_PATTERNS } from '@/lib/format/time';
import { isKnownTimeZone } from '@/lib/schemas/site';

/** What the settings mean tonight: the next net-charge moment, computed in the browser. */
export function RechargePreview({ lat, lon, elevationDeg, timeZone }: { lat: number; lon: number; elevationDeg: number; timeZone: string }) {
  // "Now" only after mount: the server's clock and zone list would not match the browser's.
  const [now, setNow] = useState<Date | null>(null);
  useEffect(() => setNow(new Date()), []);
  const ok = now !== null && [lat, lon, elevationDeg].every(Number.isFinite) && Math.abs(lat) <= 90 && Math.abs(lon) <= 180 && elevationDeg >= -18 && elevationDeg <= 60;
  if (!ok) return null;
  const zone = isKnownTimeZone(timeZone) ? timeZone : 'UTC';
  const w = dischargeWindow({ site: { lat, lon, rechargeElevationDeg: elevationDeg }, at: now });
  const local = (d: Date) => formatInTimeZone(d, zone, TIME_PATTERNS.event);
  return (
    <p className="rounded-lg border border-tide/50 bg-dusk-950 p-3 text-sm" aria-live="polite" data-testid="recharge-preview">
      {w.chargingNow ? (
        w.startAt ? (
          <>The sun is above {elevationDeg}° now: charging until dusk at <strong className="figures text-tide">{local(w.startAt)}</strong>; next net charge after that night:{' '}</>
        ) : <>The sun is above {elevationDeg}° now and does not set within 7 days (polar day).</>
      ) : <>Next net charge with these settings:{' '}</>}
      {w.chargingNow && !w.startAt ? null : <strong className="figures text-tide">{w.rechargeAt ? local(w.rechargeAt) : 'not within 7 days (polar night)'}</strong>}
    </p>
  );
}
