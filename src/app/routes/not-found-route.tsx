import { LinkButton } from "../../components/button";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { paths } from "../paths";

export function NotFoundRoute() {
  return (
    <>
      <PageHeader title="Page not found" />
      <Notice tone="attention" title="Nothing at this address">
        The link may be old or mistyped.
      </Notice>
      <p className="mt-4">
        <LinkButton to={paths.home}>Go to the start</LinkButton>
      </p>
    </>
  );
}
