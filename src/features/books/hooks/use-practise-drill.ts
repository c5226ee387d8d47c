import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { fetchBookDrill } from '../api/books';

/**
 * Opens a book's drill on the practice page: the drill is fetched first (the server answers
 * 404 when it is not the viewer's to open), then sent as ?spec=&order=.
 */
export function usePractiseDrill(bookId: string) {
  const navigate = useNavigate();
  const [error, setError] = useState<string | null>(null);
  const [opening, setOpening] = useState<string | null>(null);
  async function practise(drillId: string) {
    setError(null);
    setOpening(drillId);
    try {
      const { drill } = await fetchBookDrill(bookId, drillId);
      const params = new URLSearchParams({ spec: JSON.stringify(drill.spec), order: drill.keyCycle ?? 'chromatic' });
      navigate(`/practice?${params.toString()}`);
    } catch (err) {
      setError(err instanceof Error ? err.message : 'That drill could not be opened');
    } finally {
      setOpening(null);
    }
  }
  return { practise, error, opening };
}
