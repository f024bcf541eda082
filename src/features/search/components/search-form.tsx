import { useId, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { limits } from '@shared/validations';
import { paths } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/field';

/** A search box that opens the search page with what was typed (used on the home page). */
export function SearchForm({ label = 'Search steels, abrasives, methods and results' }: { label?: string }) {
  const id = useId();
  const [q, setQ] = useState('');
  const navigate = useNavigate();
  return (
    <form
      role="search"
      className="flex flex-col gap-1"
      onSubmit={(e) => {
        e.preventDefault();
        if (q.trim()) navigate(paths.search.getHref(q.trim()));
      }}
    >
      <label htmlFor={id} className="font-medium">
        {label}
      </label>
      <div className="flex gap-2">
        <Input
          id={id}
          type="search"
          value={q}
          maxLength={limits.searchQueryMax}
          placeholder="e.g. D2, 1.2379, CBN, F400"
          onChange={(e) => setQ(e.target.value)}
        />
        <Button type="submit">Search</Button>
      </div>
    </form>
  );
}
