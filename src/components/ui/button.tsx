import type { ComponentProps } from "react";
import { Link, type LinkProps } from "react-router-dom";
import { Spinner } from "./spinner";

type Variant = "primary" | "secondary" | "quiet" | "danger";

const base =
  "inline-flex min-h-touch min-w-touch items-center justify-center gap-2 rounded-md px-4 font-sans text-body font-semibold " +
  "transition-colors disabled:cursor-not-allowed disabled:opacity-60";

const variants: Record<Variant, string> = {
  primary: "bg-anneal-600 text-white hover:bg-anneal-700 active:bg-anneal-800",
  secondary: "border border-flux-300 bg-white text-flux-800 hover:border-flux-500 hover:bg-flux-50",
  quiet: "text-flux-700 underline-offset-4 hover:bg-flux-100 hover:underline",
  danger: "bg-danger-700 text-white hover:bg-danger-900",
};

export function buttonClass(variant: Variant = "primary", extra = ""): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}

interface ButtonProps extends ComponentProps<"button"> {
  variant?: Variant;
  /** While true the button is disabled and says what is happening. */
  pending?: boolean;
  pendingLabel?: string;
}

export function Button({ variant = "primary", pending = false, pendingLabel, className = "", disabled, children, type = "button", ...rest }: ButtonProps) {
  return (
    <button
      type={type}
      className={buttonClass(variant, className)}
      disabled={disabled || pending}
      aria-busy={pending || undefined}
      {...rest}
    >
      {pending && <Spinner />}
      {pending && pendingLabel ? pendingLabel : children}
    </button>
  );
}

export function ButtonLink({ variant = "secondary", className = "", ...rest }: LinkProps & { variant?: Variant }) {
  return <Link className={buttonClass(variant, className)} {...rest} />;
}
