import { ROLES, type Role } from '@shared/roles';
import { paths } from '@web/config/paths';
import {
  CircleHelp,
  FilePlus2,
  FolderKanban,
  Inbox,
  KeyRound,
  type LucideIcon,
  Mail,
  Users,
} from 'lucide-react';

export interface NavItem {
  label: string;
  href: string;
  icon: LucideIcon;
  roles: readonly Role[];
  /** Whether the item is the current page; defaults to an exact path match. */
  isCurrent?: (pathname: string) => boolean;
}

export interface NavSection {
  label: string;
  items: NavItem[];
}

/**
 * The navigation, by role. Later pages slot in here: Upload and Workspace (investigator),
 * Review queue (reviewer), Archives (legal), Fixes (engineer), Outbox (admin).
 */
export const NAV_SECTIONS: NavSection[] = [
  {
    label: 'Investigation',
    items: [
      {
        label: 'Cases',
        href: paths.cases.href(),
        icon: FolderKanban,
        roles: ROLES,
        isCurrent: (pathname) => pathname.startsWith(paths.cases.href()) && pathname !== paths.newCase.href(),
      },
      { label: 'New case', href: paths.newCase.href(), icon: FilePlus2, roles: ['investigator'] },
      {
        label: 'Review queue',
        href: paths.reviewQueue.href(),
        icon: Inbox,
        roles: ['reviewer'],
        // The case list with the in-review filter; "Cases" stays current for the unfiltered list.
        isCurrent: () => false,
      },
    ],
  },
  {
    label: 'Administration',
    items: [
      { label: 'Users', href: paths.users.href(), icon: Users, roles: ['admin'] },
      { label: 'Outbox', href: paths.outbox.href(), icon: Mail, roles: ['admin'] },
      { label: 'Keys and evidence', href: paths.evidenceAdmin.href(), icon: KeyRound, roles: ['admin'] },
    ],
  },
  {
    label: 'Reference',
    items: [{ label: 'Help', href: paths.help.href(), icon: CircleHelp, roles: ROLES }],
  },
];

/** The sections and items a role may see; sections left empty are dropped. */
export function navigationFor(role: Role): NavSection[] {
  return NAV_SECTIONS.map((section) => ({
    ...section,
    items: section.items.filter((item) => item.roles.includes(role)),
  })).filter((section) => section.items.length > 0);
}

/** Roles that may open a case (the API allows the same). */
export const CASE_CREATOR_ROLES: readonly Role[] = ['investigator', 'admin'];
