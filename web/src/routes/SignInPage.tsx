// Sign-in with e-mail and password, and a way to ask for a password-reset mail.
import { useState, type FormEvent } from 'react';
import { Navigate, useLocation, useNavigate } from 'react-router-dom';
import { useRequestPasswordReset, useSession, useSignIn } from '../api/session.js';
import { AuthFrame } from '../components/AuthFrame.js';
import { ErrorNote, Loading, Notice } from '../components/States.js';

export function SignInPage() {
  const session = useSession();
  const signIn = useSignIn();
  const reset = useRequestPasswordReset();
  const navigate = useNavigate();
  const location = useLocation();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [forgot, setForgot] = useState(false);
  const from = (location.state as { from?: string } | null)?.from ?? '/studies';

  if (session.isPending) return <AuthFrame title="Sign in"><Loading /></AuthFrame>;
  if (session.data) return <Navigate to={from} replace />;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (forgot) reset.mutate({ email });
    else signIn.mutate({ email, password }, { onSuccess: () => navigate(from, { replace: true }) });
  };

  return (
    <AuthFrame title={forgot ? 'Reset your password' : 'Sign in'}>
      <form onSubmit={submit} className="space-y-3" aria-label={forgot ? 'Password reset' : 'Sign in'}>
        <div>
          <label htmlFor="email" className="field-label">E-mail</label>
          <input id="email" name="email" type="email" autoComplete="username" required className="input" value={email} onChange={(e) => setEmail(e.target.value)} />
        </div>
        {!forgot && (
          <div>
            <label htmlFor="password" className="field-label">Password</label>
            <input id="password" name="password" type="password" autoComplete="current-password" required className="input" value={password} onChange={(e) => setPassword(e.target.value)} />
          </div>
        )}
        {signIn.isError && !forgot && <ErrorNote error={signIn.error} title="Sign-in failed" />}
        {reset.isError && forgot && <ErrorNote error={reset.error} />}
        {reset.isSuccess && forgot && <Notice>If that address belongs to an account, a reset link is on its way.</Notice>}
        <button type="submit" className="btn btn-primary w-full justify-center" disabled={signIn.isPending || reset.isPending}>
          {forgot ? 'Send reset link' : signIn.isPending ? 'Signing in…' : 'Sign in'}
        </button>
        <button type="button" className="link block text-sm" onClick={() => { setForgot(!forgot); reset.reset(); signIn.reset(); }}>
          {forgot ? 'Back to sign-in' : 'Forgot your password?'}
        </button>
      </form>
    </AuthFrame>
  );
}
