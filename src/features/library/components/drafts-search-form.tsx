import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';

export interface DraftsSearchFormProps {
  query: string;
  onSearch: (query: string) => void;
}

/** Search by name or tag; applied on Enter or the button, so each keystroke is not a request. */
export function DraftsSearchForm({ query, onSearch }: DraftsSearchFormProps) {
  const [text, setText] = useState(query);
  const [shownQuery, setShownQuery] = useState(query);
  // Follow the URL when it changes under us (back button, "Clear search").
  if (query !== shownQuery) {
    setShownQuery(query);
    setText(query);
  }

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    onSearch(text.trim());
  };

  return (
    <form role="search" onSubmit={submit} className="flex items-end gap-2">
      <div className="flex flex-col gap-1">
        <label htmlFor="drafts-search" className="text-sm font-medium">
          Search drafts
        </label>
        <input
          id="drafts-search"
          type="search"
          value={text}
          onChange={(event) => setText(event.target.value)}
          placeholder="Name or tag"
          className="w-64 rounded-md border border-field bg-surface px-3 py-2 text-sm"
        />
      </div>
      <Button type="submit">Search</Button>
    </form>
  );
}
