import { Link } from 'react-router-dom';

/** The way from a draft to its versions. */
export function DraftHistoryLink({ draftId }: { draftId: number }) {
  return <Link to={`/drafts/${draftId}/history`}>History</Link>;
}
