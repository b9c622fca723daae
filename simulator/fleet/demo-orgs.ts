// The invented demo organizations and sites (DESIGN.md §8). Every name and place is made up.

export interface DemoOrganization { slug: string; name: string }

export interface DemoSite {
  slug: string;
  organizationSlug: string;
  name: string;
  latDeg: number;
  lonDeg: number;
  timeZone: string;
  /** Mean December air temperature and half its day-night swing, °C (invented). */
  meanTempC: number;
  tempSwingC: number;
  /** When the owner reckons charge starts: the sun's true elevation, degrees (the product's site setting). */
  rechargeElevationDeg: number;
  /** Terrain that hides the low sun from the panels, degrees of true elevation (0: open sky). */
  horizonDeg: number;
  description: string;
}

export const demoOrganization: DemoOrganization = { slug: 'larkspur-hollow', name: 'Larkspur Hollow Watershed Trust' };
export const secondDemoOrganization: DemoOrganization = { slug: 'cinder-flats', name: 'Cinder Flats Field Station' };
export const demoOrganizations: DemoOrganization[] = [demoOrganization, secondDemoOrganization];

// A fictional valley near 47° N on the dry side of a mountain range; Pacific time fits −120.5°.
// Open sites reckon charge from 3° (a small panel gives net charge a little after sunrise).
const VALLEY = { organizationSlug: demoOrganization.slug, timeZone: 'America/Los_Angeles', tempSwingC: 4, rechargeElevationDeg: 3, horizonDeg: 0 };

export const demoSites: DemoSite[] = [
  { ...VALLEY, slug: 'north-fork-weir', name: 'North Fork weir', latDeg: 47.142, lonDeg: -120.583, meanTempC: -2,
    description: 'V-notch weir on the North Fork, stage and bank soil moisture.' },
  { ...VALLEY, slug: 'mill-pond-outlet', name: 'Mill Pond outlet', latDeg: 47.097, lonDeg: -120.541, meanTempC: -1,
    description: 'Outlet channel below the old mill pond; stage and riparian soil.' },
  { ...VALLEY, slug: 'upper-meadow-piezometer', name: 'Upper Meadow piezometer', latDeg: 47.181, lonDeg: -120.622, meanTempC: -4,
    description: 'Groundwater piezometers across the upper meadow.' },
  // The road cut hides the morning sun until it clears 13°, so its owner reckons charge from 14°.
  // (It also keeps the demo's story whatever hour it is seeded: this site's recharge comes about
  // an hour and a half after the open sites', so the nodes tuned to be thin here and at an open
  // site are never both in the hour before their recharge; see DemoNode.cadenceFor.)
  { ...VALLEY, slug: 'quarry-road-culvert', name: 'Quarry Road culvert', latDeg: 47.063, lonDeg: -120.497, meanTempC: 0,
    rechargeElevationDeg: 14, horizonDeg: 13, description: 'Culvert in the Quarry Road cut: storm stage and road-side soil.' },
];

export const secondDemoSites: DemoSite[] = [
  { slug: 'cinder-flats-mesa', organizationSlug: secondDemoOrganization.slug, name: 'Cinder Flats mesa',
    latDeg: 43.412, lonDeg: -117.236, timeZone: 'America/Boise', meanTempC: 1, tempSwingC: 7,
    rechargeElevationDeg: 3, horizonDeg: 0, description: 'Two weather nodes on an open lava mesa.' },
];
