// Sign-in and sign-up, validated in the browser and answered in words when the server says no.
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState } from 'react';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { api, ApiClientError } from '@/lib/client/api';
import { safeNext } from '@/lib/http/redirect';

const PASSWORD_MIN = 10;

const signInSchema = z.object({
  email: z.email('Enter the e-mail address you signed up with.'),
  password: z.string().min(1, 'Enter your password.'),
});
const signUpSchema = z.object({
  name: z.string().trim().min(1, 'Tell us your name.').max(100, 'Keep the name under 100 characters.'),
  email: z.email('Enter a valid e-mail address.'),
  password: z
    .string()
    .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`)
    .max(128, 'Use at most 128 characters.'),
});
type Values = { name?: string; email: string; password: string };

/** Words for better-auth's error codes, in our own voice. */
const SERVER_WORDS: Record<string, string> = {
  INVALID_EMAIL_OR_PASSWORD: 'That e-mail and password do not match an account.',
  USER_ALREADY_EXISTS: 'An account with this e-mail already exists. Sign in instead.',
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: 'An account with this e-mail already exists. Sign in instead.',
  PASSWORD_TOO_SHORT: `The password is too short: use at least ${PASSWORD_MIN} characters.`,
  PASSWORD_TOO_LONG: 'The password is too long: use at most 128 characters.',
  INVALID_EMAIL: 'That e-mail address does not look right.',
};

export default function AuthForm({ mode, next }: { mode: 'sign-in' | 'sign-up'; next: string }) {
  const signUp = mode === 'sign-up';
  const [serverError, setServerError] = useState<string | null>(null);
  // The button waits for this island to run: a click before then would be the browser's own submit, which puts
  // nothing in the address (method post) but signs nobody in, and the person would be left wondering.
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<Values>({ resolver: zodResolver(signUp ? signUpSchema : signInSchema) as never, mode: 'onTouched' });

  const onSubmit = handleSubmit(async (values) => {
    setServerError(null);
    try {
      // A new account's address link leads back to where the person was going (an invitation, say).
      await api(`/api/auth/${mode}/email`, { method: 'POST', body: signUp ? { ...values, callbackURL: next } : values });
      location.assign(safeNext(next));
    } catch (err) {
      if (err instanceof ApiClientError) {
        if (err.status === 429) setServerError('Too many attempts from here. Wait a minute, then try again.');
        else setServerError(SERVER_WORDS[err.code] ?? err.message);
      } else setServerError('Something went wrong. Please try again.');
    }
  });

  const fieldError = (name: keyof Values) =>
    errors[name] ? (
      <p id={`${name}-error`} className="error-text">
        {errors[name]?.message}
      </p>
    ) : null;

  return (
    <form method="post" onSubmit={onSubmit} noValidate className="space-y-5" aria-describedby={serverError ? 'form-error' : undefined}>
      {serverError && (
        <div id="form-error" role="alert" className="rounded-md border border-danger/30 bg-danger-wash px-4 py-3 text-sm text-danger">
          {serverError}
        </div>
      )}
      {signUp && (
        <div>
          <label htmlFor="name" className="label">Your name</label>
          <input id="name" className="field" autoComplete="name" aria-invalid={!!errors.name} aria-describedby={errors.name ? 'name-error' : undefined} {...register('name')} />
          {fieldError('name')}
        </div>
      )}
      <div>
        <label htmlFor="email" className="label">E-mail</label>
        <input id="email" type="email" className="field" autoComplete="email" aria-invalid={!!errors.email} aria-describedby={errors.email ? 'email-error' : undefined} {...register('email')} />
        {fieldError('email')}
      </div>
      <div>
        <label htmlFor="password" className="label">Password</label>
        <input
          id="password"
          type="password"
          className="field"
          autoComplete={signUp ? 'new-password' : 'current-password'}
          aria-invalid={!!errors.password}
          aria-describedby={[errors.password ? 'password-error' : '', signUp ? 'password-hint' : ''].filter(Boolean).join(' ') || undefined}
          {...register('password')}
        />
        {signUp && !errors.password && <p id="password-hint" className="hint">At least {PASSWORD_MIN} characters.</p>}
        {fieldError('password')}
      </div>
      <button type="submit" className="btn-primary w-full py-2.5" disabled={!ready || isSubmitting}>
        {isSubmitting ? (signUp ? 'Creating your account…' : 'Signing in…') : signUp ? 'Create account' : 'Sign in'}
      </button>
    </form>
  );
}
