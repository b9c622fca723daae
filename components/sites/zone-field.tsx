'use client';

import { useEffect, useMemo, useState } from 'react';
import { Field } from '@/components/ui/field';
import { formatInTimeZone } from '@/lib/format/time';
import { describeZoneNow, formatUtcOffset, utcOffsetMinutes, zoneChoices } from './zone-offset';

/**
 * The site's time zone: typed or picked from the browser's IANA list (each with its offset
 * now), and the chosen zone's UTC offset and clock beside it, so a deployer can check it.
 */
export function ZoneField({ value, onChange, error }: { value: string; onChange: (e: { target: { value: string } }) => void; error?: string }) {
  // The zone list and "now" only after mount: the server's would differ and not hydrate.
  const [now, setNow] = useState<Date | null>(null);
  const [zones, setZones] = useState<string[]>([]);
  useEffect(() => {
    setNow(new Date());
    setZones(zoneChoices(Intl.supportedValuesOf('timeZone')));
  }, []);
  const labels = useMemo(() => {
    if (!now) return new Map<string, string>();
    return new Map(zones.map((z) => {
      const minutes = utcOffsetMinutes(z, now);
      return [z, minutes === null ? '' : formatUtcOffset(minutes)];
    }));
  }, [zones, now]);
  const zoneNow = now ? describeZoneNow(value, now) : null;
  return (
    <div className="flex flex-col gap-1">
      <Field id="site-zone" label="Time zone" hint="IANA name, such as America/Los_Angeles; times on every page are shown in it."
        list="site-zone-list" value={value} onChange={onChange} error={error} autoComplete="off" spellCheck={false}
        aria-describedby={`${error ? 'site-zone-error' : 'site-zone-hint'} site-zone-offset`} />
      <datalist id="site-zone-list">{zones.map((z) => <option key={z} value={z} label={labels.get(z) || undefined} />)}</datalist>
      <p id="site-zone-offset" aria-live="polite" className="min-h-5 text-sm text-ink-muted" data-testid="site-zone-offset">
        {zoneNow ? (
          <>
            <span className="figures">{zoneNow.text}</span>
            {zoneNow.known ? <> · clock there <span className="figures">{formatInTimeZone(now!, value.trim(), 'HH:mm')}</span></> : null}
          </>
        ) : null}
      </p>
    </div>
  );
}
