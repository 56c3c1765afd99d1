import Link from "next/link";

/**
 * A name that may be long (a study, specimen, file or kinetics name of 100+ characters): cut to
 * one line with an ellipsis at a width that keeps a table's other columns on screen (40 % of a
 * phone's width, 20rem from 640 px up), the whole name on hover (title) and for screen readers
 * (the text itself stays in the page, only clipped).
 */
const CUT = "inline-block max-w-[40vw] truncate align-bottom sm:max-w-[20rem]";

export function LongName({
  text,
  href,
  download = false,
  className = "",
  testId,
}: {
  text: string;
  href?: string;
  /** A file download (an API address, not a page): a plain link, not the router's. */
  download?: boolean;
  className?: string;
  testId?: string;
}) {
  const props = { title: text, className: `${CUT} ${className}`, "data-testid": testId };
  if (href && download)
    return (
      <a href={href} {...props}>
        {text}
      </a>
    );
  if (href)
    return (
      <Link href={href} {...props}>
        {text}
      </Link>
    );
  return <span {...props}>{text}</span>;
}
