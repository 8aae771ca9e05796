/**
 * Mail is read outside the app, so every link in it must be absolute. Writers of mail give
 * app paths ("/qualifications/12", "/sources?housePartId=3"); this prefixes each path that
 * stands as its own word (start of a line, or after a space, "(" or ":") with the public URL.
 */
export function absoluteLinks(body: string, publicUrl: string): string {
  const base = publicUrl.replace(/\/$/, '');
  return body.replace(/(^|[\s(])(\/[a-z][\w-]*(?:\/[\w-]+)*(?:\?[^\s)]*)?)(?=$|[\s).,;])/gm, (_, before: string, path: string) => `${before}${base}${path}`);
}
