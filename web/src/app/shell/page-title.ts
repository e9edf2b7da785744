import { useEffect } from 'react';
import { useMatches } from 'react-router-dom';

/** Route modules declare `handle: { title }`; the deepest one names the page. */
export interface RouteHandle {
  title?: string;
}

export function usePageTitle(): string | undefined {
  const matches = useMatches();
  const title = [...matches].reverse().find((match) => (match.handle as RouteHandle | undefined)?.title)
    ?.handle as RouteHandle | undefined;
  const text = title?.title;
  useEffect(() => {
    document.title = text ? `${text} · Driftcase` : 'Driftcase';
  }, [text]);
  return text;
}
