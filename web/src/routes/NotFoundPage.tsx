import { Link } from 'react-router-dom';
import { Empty } from '../components/States.js';

export function NotFoundPage() {
  return (
    <Empty>
      No page here. <Link className="link" to="/studies">Back to the studies</Link>
    </Empty>
  );
}
