// Setting a new password from a mailed reset link.
import { useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useConfirmPasswordReset } from '../api/session.js';
import { AuthFrame } from '../components/AuthFrame.js';
import { ErrorNote, Notice } from '../components/States.js';

export function ResetPasswordPage() {
  const { token = '' } = useParams();
  const confirm = useConfirmPasswordReset();
  const [password, setPassword] = useState('');

  const submit = (e: FormEvent) => {
    e.preventDefault();
    confirm.mutate({ token, password });
  };

  return (
    <AuthFrame title="Choose a new password">
      {confirm.isSuccess ? (
        <Notice>
          Your password is changed. <Link className="link" to="/sign-in">Sign in</Link>
        </Notice>
      ) : (
        <form onSubmit={submit} className="space-y-3" aria-label="New password">
          <div>
            <label htmlFor="reset-password" className="field-label">New password (at least 10 characters)</label>
            <input id="reset-password" type="password" autoComplete="new-password" minLength={10} required className="input" value={password} onChange={(e) => setPassword(e.target.value)} />
          </div>
          {confirm.isError && <ErrorNote error={confirm.error} title="The password was not changed" />}
          <button type="submit" className="btn btn-primary w-full justify-center" disabled={confirm.isPending || password.length < 10}>Set password</button>
        </form>
      )}
    </AuthFrame>
  );
}
