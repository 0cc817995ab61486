import type { OrganisationKind, Role, ShareAccess } from '@shared/auth/roles';
import type { SiteKind } from '@shared/sites/site';

/**
 * Rillmark's demo scenario. Every place, person and company here is invented; the e-mail domains use
 * the reserved `.example` top-level domain.
 */
export const DEMO_PASSWORD = 'rillmark-demo-2026';

export interface DemoOrganisation {
  key: string;
  name: string;
  kind: OrganisationKind;
}

export interface DemoUser {
  email: string;
  displayName: string;
  organisation: string;
  role: Role;
}

export interface DemoSite {
  organisation: string;
  name: string;
  kind: SiteKind;
  address: string;
  timeZone: string;
  notes: string;
  tags: string[];
  shares: { organisation: string; access: ShareAccess }[];
}

export const DEMO_ORGANISATIONS: DemoOrganisation[] = [
  { key: 'cobalt', name: 'Cobalt Ridge Property Services', kind: 'property-manager' },
  { key: 'thistlewood', name: 'Thistlewood Landscape Cooperative', kind: 'contractor' },
  { key: 'verdella', name: 'Verdella Valley Water Agency — Conservation Office', kind: 'utility' },
  { key: 'harrowgate', name: 'Harrowgate Estates Management', kind: 'property-manager' },
];

export const DEMO_USERS: DemoUser[] = [
  { email: 'avery.admin@cobaltridge.example', displayName: 'Avery Lindqvist', organisation: 'cobalt', role: 'admin' },
  {
    email: 'morgan.manager@cobaltridge.example',
    displayName: 'Morgan Okafor',
    organisation: 'cobalt',
    role: 'manager',
  },
  {
    email: 'casey.contractor@thistlewood.example',
    displayName: 'Casey Brandvold',
    organisation: 'thistlewood',
    role: 'contractor',
  },
  {
    email: 'alex.auditor@verdellawater.example',
    displayName: 'Alex Moreau-Tanaka',
    organisation: 'verdella',
    role: 'auditor',
  },
  {
    email: 'harper.admin@harrowgate.example',
    displayName: 'Harper Quillfeather',
    organisation: 'harrowgate',
    role: 'admin',
  },
];

const LA = 'America/Los_Angeles';
const utility = { organisation: 'verdella', access: 'read' as const };
const contractor = { organisation: 'thistlewood', access: 'contribute' as const };

export const DEMO_SITES: DemoSite[] = [
  {
    organisation: 'cobalt',
    name: 'Willowmere HOA — North Commons',
    kind: 'hoa-common-area',
    address: '410 Larkfield Loop, Verdella',
    timeZone: LA,
    notes: 'Dedicated reclaimed-water irrigation meter; drip in shrub beds, rotors on the turf bowl.',
    tags: ['reclaimed', 'hoa', 'north-valley'],
    shares: [contractor, utility],
  },
  {
    organisation: 'cobalt',
    name: 'Willowmere HOA — South Greenbelt',
    kind: 'hoa-common-area',
    address: '88 Fennel Court, Verdella',
    timeZone: LA,
    notes: 'Spray zones along the greenbelt path; retrofit to drip planned for spring.',
    tags: ['reclaimed', 'hoa', 'north-valley'],
    shares: [contractor, utility],
  },
  {
    organisation: 'cobalt',
    name: 'Sagebrook Village Entry and Parks',
    kind: 'hoa-common-area',
    address: '2 Sagebrook Parkway, Calloway Flats',
    timeZone: LA,
    notes: 'Entry monument beds and two tot-lot lawns on a potable meter.',
    tags: ['potable', 'hoa'],
    shares: [utility],
  },
  {
    organisation: 'cobalt',
    name: 'Tannery Point Office Park',
    kind: 'office-park',
    address: '1500 Tannery Point Drive, Verdella',
    timeZone: LA,
    notes: 'Four buildings; bioswales and parking-lot islands on drip.',
    tags: ['reclaimed', 'commercial'],
    shares: [contractor, utility],
  },
  {
    organisation: 'cobalt',
    name: 'Quarry Oaks Business Campus',
    kind: 'office-park',
    address: '77 Quarry Oaks Road, Bellmoor',
    timeZone: LA,
    notes: 'Mixed meter (restrooms and irrigation) until the dedicated meter is set.',
    tags: ['potable', 'commercial', 'mixed-meter'],
    shares: [],
  },
  {
    organisation: 'cobalt',
    name: 'Juniper Hollow Elementary Fields',
    kind: 'school-ground',
    address: '300 Juniper Hollow Lane, Calloway Flats',
    timeZone: LA,
    notes: 'Recreational turf (special landscape area) on reclaimed water; watering window 21:00–05:00.',
    tags: ['reclaimed', 'school', 'north-valley'],
    shares: [utility],
  },
  {
    organisation: 'cobalt',
    name: 'Alder Creek Parkway Medians',
    kind: 'streetscape',
    address: 'Alder Creek Parkway, km 2–5, Verdella',
    timeZone: LA,
    notes: 'Medians on drip with pressure-regulated, filtered valve assemblies.',
    tags: ['reclaimed', 'streetscape'],
    shares: [contractor],
  },
  {
    organisation: 'cobalt',
    name: 'Foxtail Mesa Office Commons',
    kind: 'office-park',
    address: '9 Foxtail Mesa Way, Red Tamarack',
    timeZone: 'America/Phoenix',
    notes: 'Desert planting, low water use; no daylight-saving time in this zone.',
    tags: ['potable', 'commercial', 'desert'],
    shares: [],
  },
  {
    organisation: 'harrowgate',
    name: 'Harrowgate Manor Grounds',
    kind: 'hoa-common-area',
    address: '1 Harrowgate Close, Bellmoor',
    timeZone: LA,
    notes: 'Belongs to another management company: Cobalt Ridge users must never see it.',
    tags: ['potable', 'hoa'],
    shares: [],
  },
  {
    organisation: 'harrowgate',
    name: 'Harrowgate Lakeside Walk',
    kind: 'park',
    address: '40 Lakeside Walk, Bellmoor',
    timeZone: LA,
    notes: 'Lakeside turf and shrub beds.',
    tags: ['potable'],
    shares: [utility],
  },
];
