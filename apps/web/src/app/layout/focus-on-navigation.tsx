import { useEffect, useRef } from 'react';
import { useLocation } from 'react-router-dom';

/**
 * After moving to another page, focus goes to the main region, so keyboard and screen-reader
 * users start at the new content instead of wherever the old page left them.
 */
export function FocusOnNavigation() {
  const { pathname } = useLocation();
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    const main = document.getElementById('main');
    if (main && !main.contains(document.activeElement)) main.focus();
  }, [pathname]);
  return null;
}
