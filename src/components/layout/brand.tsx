import { Link } from 'react-router';
import { paths } from '@/config/paths';

export function Brand() {
  return (
    <Link
      to={paths.home.getHref()}
      className="flex items-center gap-2 font-semibold tracking-tight text-ink"
    >
      <svg viewBox="0 0 32 32" className="size-7" aria-hidden>
        <rect width="32" height="32" rx="7" fill="#0f5e63" />
        <path d="M8 11h7v10H8zM17 11h7v10h-7z" fill="none" stroke="#fff" strokeWidth="2" />
        <circle cx="20.5" cy="16" r="2.2" fill="#f0a830" />
      </svg>
      <span>Choicewright</span>
    </Link>
  );
}
