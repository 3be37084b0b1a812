// Accepting an invitation from a mailed link: choose a name and a password, then signed in.
import { useState, type FormEvent } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { useAcceptInvite } from '../api/session.js';
import { AuthFrame } from '../components/AuthFrame.js';
import { ErrorNote } from '../components/States.js';

export function InvitePage() {
  const { token = '' } = useParams();
  const accept = useAcceptInvite();
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const tooShort = password.length > 0 && password.length < 10;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    accept.mutate({ token, password, name: name || undefined }, { onSuccess: () => navigate('/studies', { replace: true }) });
  };

  return (
    <AuthFrame title="Join the team">
      <form onSubmit={submit} className="space-y-3" aria-label="Accept invitation">
        <div>
          <label htmlFor="name" className="field-label">Your name</label>
          <input id="name" className="input" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} />
        </div>
        <div>
          <label htmlFor="new-password" className="field-label">Password (at least 10 characters)</label>
          <input id="new-password" type="password" autoComplete="new-password" minLength={10} required className="input" value={password} onChange={(e) => setPassword(e.target.value)} aria-invalid={tooShort || undefined} />
        </div>
        {accept.isError && <ErrorNote error={accept.error} title="The invitation could not be accepted" />}
        <button type="submit" className="btn btn-primary w-full justify-center" disabled={accept.isPending || password.length < 10}>Create my account</button>
      </form>
    </AuthFrame>
  );
}
