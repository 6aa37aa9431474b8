/**
 * A space that ends a piece of text drawn in its own box beside another (a name, then its
 * code). Boxes keep words apart on screen but not in the page's text: without it the row
 * reads "Amberlyn ReachD01" to anything that joins the text of a control, such as axe-core's
 * label-in-name check (WCAG 2.2 SC 2.5.3) or a copy of the row. Put it inside a Text that
 * does not wrap (`numberOfLines={1}`): a space at the end of such a line takes no room.
 */
export const WORD_BREAK = ' ';
