// The list page's skeleton while it reads (components/ui/route-loading.tsx says where one may go).
export { default } from "@/components/ui/route-loading";
