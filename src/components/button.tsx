import type { ButtonHTMLAttributes, ReactNode } from "react";
import { Link, type LinkProps } from "react-router-dom";
import { cx } from "../lib/cx";

export type ButtonTone = "primary" | "secondary" | "danger" | "quiet";

const base =
  "inline-flex min-h-touch min-w-touch items-center justify-center gap-2 rounded-lg px-5 py-2 " +
  "text-base font-semibold leading-tight no-underline select-none " +
  "disabled:cursor-not-allowed disabled:opacity-60";

const tones: Record<ButtonTone, string> = {
  primary: "border-2 border-primary bg-primary text-on-primary hover:opacity-90",
  secondary: "border-2 border-ink bg-surface text-ink hover:bg-primary-soft",
  danger: "border-2 border-danger bg-surface text-danger-ink hover:bg-danger-soft",
  quiet: "border-2 border-transparent bg-transparent text-ink underline-offset-4 hover:underline",
};

export function buttonClasses(tone: ButtonTone = "secondary", extra?: string): string {
  return cx(base, tones[tone], extra);
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  tone?: ButtonTone;
  children: ReactNode;
}

export function Button({ tone = "secondary", className, type = "button", ...rest }: ButtonProps) {
  return <button type={type} className={buttonClasses(tone, className)} {...rest} />;
}

interface LinkButtonProps extends LinkProps {
  tone?: ButtonTone;
}

export function LinkButton({ tone = "secondary", className, ...rest }: LinkButtonProps) {
  return (
    <Link
      className={buttonClasses(tone, typeof className === "string" ? className : "")}
      {...rest}
    />
  );
}
