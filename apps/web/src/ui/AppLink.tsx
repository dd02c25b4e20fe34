import type { ReactNode } from 'react';
import { Link } from '@fluentui/react-components';
import { useHref, useLinkClickHandler } from 'react-router-dom';

export interface AppLinkProps {
  to: string;
  children: ReactNode;
  className?: string;
  inline?: boolean;
}

/** A Fluent link that navigates inside the app (and still opens in a new tab on ctrl/cmd-click). */
export function AppLink({ to, children, className, inline }: AppLinkProps) {
  const href = useHref(to);
  const handleClick = useLinkClickHandler<HTMLAnchorElement>(to);
  return (
    <Link as="a" href={href} onClick={handleClick} className={className} inline={inline}>
      {children}
    </Link>
  );
}
