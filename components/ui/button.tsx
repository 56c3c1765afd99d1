import Link from "next/link";
import type { ButtonHTMLAttributes, ComponentProps } from "react";

type Variant = "primary" | "secondary" | "danger" | "ghost";

const styles: Record<Variant, string> = {
  primary: "bg-moss text-white hover:bg-moss-dark border border-moss-dark",
  secondary: "bg-card text-ink border border-rule hover:bg-paper-deep",
  danger: "bg-card text-brick border border-brick/40 hover:bg-brick-soft",
  ghost: "text-ink-soft hover:text-ink hover:bg-paper-deep border border-transparent",
};

export function buttonClass(variant: Variant = "primary", size: "sm" | "md" = "md") {
  const pad = size === "sm" ? "px-2.5 py-1 text-sm" : "px-4 py-2 text-sm";
  return `inline-flex items-center justify-center gap-1.5 rounded-md font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-50 ${pad} ${styles[variant]}`;
}

export function Button({
  variant = "primary",
  size = "md",
  className = "",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: "sm" | "md" }) {
  return <button type="button" {...props} className={`${buttonClass(variant, size)} ${className}`} />;
}

export function LinkButton({
  variant = "primary",
  size = "md",
  className = "",
  ...props
}: ComponentProps<typeof Link> & { variant?: Variant; size?: "sm" | "md" }) {
  return <Link {...props} className={`${buttonClass(variant, size)} ${className}`} />;
}
