// The client's names for the contract's shapes, all from the zod schemas in shared/api (types only,
// so zod itself stays out of the browser bundle).
export type {
  AuthResponse,
  CapturedMail,
  DraftDetail,
  DraftListResponse,
  DraftSummary,
  Membership,
  SessionResponse,
  SessionUser,
  Studio,
  StudioDetailResponse,
  StudioListItem,
  StudioMember,
  StudioRole,
} from '../../shared/api';
