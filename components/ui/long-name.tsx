import Link from "next/link";

/**
 * A name that may be long (a study, specimen, file or kinetics name of 100+ characters): cut to
 * one line with an ellipsis at a width that keeps a table's other columns on screen (about a third
 * of a phone's width, 20rem from 640 px up; "short", 11rem, for a second name in the same row), the whole
 * name on hover (title) and for screen readers (the text itself stays in the page, only clipped).
 * Tailwind needs the class names spelled out.
 */
const CUT = {
  name: "inline-block max-w-[36vw] truncate align-bottom sm:max-w-[20rem]",
  short: "inline-block max-w-[24vw] truncate align-bottom sm:max-w-[11rem]",
  /** As wide as its flex row leaves it (a list item's name beside a status): a flex item that may shrink. */
  fill: "min-w-0 max-w-full truncate",
};

export function LongName({
  text,
  href,
  download = false,
  className = "",
  testId,
  size = "name",
}: {
  text: string;
  href?: string;
  /** A file download (an API address, not a page): a plain link, not the router's. */
  download?: boolean;
  className?: string;
  testId?: string;
  size?: keyof typeof CUT;
}) {
  const props = { title: text, className: `${CUT[size]} ${className}`, "data-testid": testId };
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
