"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useState } from "react";

/**
 * The lab's navigation: one row from 768 px up (it has a band of its own under the header, so nine
 * links fit at 1024 px), a "Menu" button that opens it as a column below that.
 */
export function LabNav({ items }: { items: { href: string; label: string }[] }) {
  const pathname = usePathname();
  const [open, setOpen] = useState(false);
  if (items.length === 0) return null;
  // The dashboard is the lab's root, so it is current only on an exact match.
  const current = (href: string) => pathname === href || (href !== items[0].href && pathname.startsWith(`${href}/`));
  return (
    <div className="border-t border-rule/70">
      <div className="mx-auto max-w-7xl px-6">
        <button
          type="button"
          className="my-1.5 rounded px-2 py-1 text-sm text-ink-soft hover:bg-paper-deep hover:text-ink md:hidden"
          aria-expanded={open}
          aria-controls="lab-nav"
          onClick={() => setOpen((o) => !o)}
          data-testid="lab-nav-toggle"
        >
          {open ? "Close menu" : "Menu"}
        </button>
        <nav
          id="lab-nav"
          aria-label="Lab"
          data-testid="lab-nav"
          className={`${open ? "flex" : "hidden"} flex-col gap-0.5 pb-2 text-sm md:flex md:flex-row md:flex-nowrap md:items-center md:gap-1 md:py-1.5`}
        >
          {items.map((n) => (
            <Link
              key={n.href}
              href={n.href}
              aria-current={current(n.href) ? "page" : undefined}
              onClick={() => setOpen(false)}
              className="whitespace-nowrap rounded px-2 py-1 text-ink-soft hover:bg-paper-deep hover:text-ink aria-[current=page]:bg-paper-deep aria-[current=page]:font-medium aria-[current=page]:text-ink"
            >
              {n.label}
            </Link>
          ))}
        </nav>
      </div>
    </div>
  );
}
