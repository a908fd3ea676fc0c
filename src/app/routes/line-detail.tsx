export default function Page() {
  return <p>Coming soon.</p>;
}
