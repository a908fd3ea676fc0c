import { Link } from 'react-router-dom';

export default function NotFoundPage() {
  return (
    <div className="mt-16 text-center">
      <h1 className="text-xl font-semibold">There is no page here</h1>
      <Link to="/lines" className="mt-3 inline-block text-tide underline">
        Back to the line register
      </Link>
    </div>
  );
}
