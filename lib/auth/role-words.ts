import type { Role } from './roles';

/**
 * What each role may do, in plain words, for every place that tells a person about a role
 * (the team screen's role select, the invitation e-mail). They say in words what PERMISSIONS
 * in ./roles.ts grants; change both together.
 */

/** The short form beside the role's name in the team screen's select ("viewer — …"). */
export const ROLE_SUMMARY: Record<Role, string> = {
  viewer: 'reads everything, changes nothing',
  deployer: 'sites, nodes, credentials, imports, bench',
  owner: 'everything, members included',
};

/** One plain sentence of what the role may do. */
export const ROLE_SENTENCE: Record<Role, string> = {
  viewer:
    'A viewer reads everything in the organization (fleet, nodes, alerts, the planner) and changes nothing, apart from choosing which alert e-mails they get.',
  deployer:
    'A deployer reads everything and looks after sites, nodes with their bank and load settings, device credentials, imports, bench logs and field visits, and acknowledges alerts.',
  owner:
    'An owner may do everything in the organization, members included: everything a deployer does, plus inviting and removing people, changing roles and the organization settings.',
};
