// Inside the staff shell, which already provides the <main> landmark.
import { NotFoundMessage } from "@/components/shell/not-found-message";

export default function StaffNotFound() {
  return <NotFoundMessage />;
}
