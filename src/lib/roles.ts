import { ROLE_NAMES } from '../../shared/words';
import type { StudioRole } from '../types/api';

/** How each studio role is written on screen. */
export const ROLE_LABEL: Record<StudioRole, string> = ROLE_NAMES;

/** Roles from most to least able (shared/api's studioRoles, reversed; checked in tests/web/contract-constants.test.ts). */
export const STUDIO_ROLES: readonly StudioRole[] = ['owner', 'editor', 'viewer'];
