/** Bench figures: farads to 3 significant digits, ESR in mΩ, ratios as percent or times. */
export const formatFarads = (f: number) => `${f.toPrecision(3)} F`;
export const formatMilliohms = (ohms: number) => `${(ohms * 1000).toPrecision(3)} mΩ`;
export const formatRatioPercent = (r: number) => `${(r * 100).toFixed(0)} %`;
export const formatRatioTimes = (r: number) => `${r.toFixed(2)}×`;
