// Inside the office shell, which already provides the <main> landmark.
import { NotFoundMessage } from "@/components/shell/not-found-message";

export default function OfficeNotFound() {
  return <NotFoundMessage />;
}
