import { List, type ListProps } from '@mantine/core';

// Mantine's list items do not wrap long sentences beside the bullet (the item is nowrap and its
// label an inline-flex box as wide as the list): these do.
const WRAPPING = { item: { whiteSpace: 'normal' as const }, itemWrapper: { display: 'inline' as const } };

/** A bulleted list of sentences (reasons, warnings, assumptions) that wraps inside narrow panels. */
export function Notes(props: ListProps) {
  return <List styles={WRAPPING} {...props} />;
}
Notes.Item = List.Item;
