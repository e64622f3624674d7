//! The survey list's rows: each item as markup, the first `PAGE` of them shown, and the few DOM
//! edits that bring the shown rows from one list to the next.

use crate::engine::chart::svg::esc;
use crate::engine::store::Saved;
use crate::engine::survey;
use crate::engine::units::UnitChoice;

/// How to bring a list of rows from `before` to `now`: keep the first `start` rows and the `end`
/// rows before the last `drop` of `before` (removed) and the last `add` of `now` (appended);
/// replace the rows between.
#[derive(Debug, PartialEq)]
pub(super) struct Edit {
    start: usize,
    drop: usize,
    add: usize,
    end: usize,
}

pub(super) fn edit(before: &[String], now: &[String]) -> Edit {
    let start = before.iter().zip(now).take_while(|(a, b)| a == b).count();
    let tail = |b: &[String], n: &[String]| {
        b.iter()
            .rev()
            .zip(n.iter().rev())
            .take_while(|(x, y)| x == y)
            .count()
    };
    let (bl, nl) = (before.len() - start, now.len() - start);
    let (drop, add, end) = [(0, 0), (1, 0), (0, 1), (2, 0), (0, 2)]
        .into_iter()
        .filter(|&(d, a)| d <= bl && a <= nl)
        .map(|(d, a)| {
            let e = tail(&before[start..before.len() - d], &now[start..now.len() - a]);
            (d, a, e)
        })
        .max_by_key(|&(d, a, e)| (e, usize::MAX - d - a))
        .unwrap_or((0, 0, 0));
    Edit {
        start,
        drop,
        add,
        end,
    }
}

/// Bring the rows of `tb` from `before` to `now` (one markup string a row), touching as few as it
/// can: the rows between the longest common start and end are replaced. The list shows a window
/// of its rows, so an insertion pushes a row off the window's end and a deletion pulls one in:
/// the common end is also sought with up to two rows left off either list's end, and those are
/// removed or appended ([`edit`]). A duplicate or a delete then redraws a row or two, not the
/// window.
pub(super) fn redraw_changed(tb: &web_sys::Element, before: &[String], now: &[String]) {
    let Edit {
        start,
        drop,
        add,
        end,
    } = edit(before, now);
    let rows = tb.children();
    // The rows pushed off the end.
    for k in 0..drop {
        if let Some(r) = rows.item((before.len() - 1 - k) as u32) {
            r.remove();
        }
    }
    // The changed run.
    for _ in start..before.len() - drop - end {
        if let Some(r) = rows.item(start as u32) {
            r.remove();
        }
    }
    let insert = |at: usize, html: &str| {
        if !html.is_empty() {
            let _ = match rows.item(at as u32) {
                Some(next) => next.insert_adjacent_html("beforebegin", html),
                None => tb.insert_adjacent_html("beforeend", html),
            };
        }
    };
    insert(start, &now[start..now.len() - add - end].concat());
    // The rows pulled in at the end.
    insert(now.len() - add, &now[now.len() - add..].concat());
}

/// One survey row as markup: the item's name (a tap opens it), its tag and place, its figures in
/// the chosen units (`summary::cells`), and the actions in a menu; every button says what it does
/// in `data-act`.
pub(super) fn row_markup(m: &mut String, it: &Saved, res: &survey::Figure, c: &UnitChoice) {
    use std::fmt::Write;
    let [loss, surface, checks, range] = super::summary::cells(res, c);
    let name = esc(&it.name);
    let _ = write!(
        m,
        r#"<tr data-saved="{name}"><th scope="row"><button type="button" class="item-open" data-open data-act="open" title="Open this item">{name}</button><small>{}</small></th><td data-item-loss data-label="Heat loss">{}</td><td data-label="Surface">{}</td><td data-label="Checks" data-item-checks>{}</td><td data-label="Range">{}</td><td class="item-menu"><details class="menu"><summary aria-label="Actions for {name}">Actions</summary><div class="saved-actions"><button type="button" data-act="open">Open</button><button type="button" data-act="update" title="Store the inputs shown in this item">Update</button><button type="button" data-act="rename" title="Rename to the name typed above">Rename</button><button type="button" data-act="dup">Duplicate</button><button type="button" data-act="delete">Delete</button></div></details></td></tr>"#,
        esc(&super::summary::sub(it)),
        esc(&loss),
        esc(&surface),
        esc(&checks),
        esc(&range)
    );
}

/// How many rows the list shows at first, and adds at each "show more": a phone cannot use a
/// 1,000-row table, and the browser lays out only the rows shown.
pub(super) const PAGE: usize = 100;

#[cfg(test)]
mod tests {
    use super::{edit, Edit};

    /// `edit`'s plan, carried out on a plain list as `redraw_changed` carries it out on the rows.
    fn apply(before: &[String], now: &[String]) -> (Vec<String>, usize) {
        let Edit {
            start,
            drop,
            add,
            end,
        } = edit(before, now);
        let mut rows = before.to_vec();
        rows.truncate(before.len() - drop);
        let kept_end = rows.split_off(rows.len() - end);
        rows.truncate(start);
        let new = &now[start..now.len() - add - end];
        rows.extend_from_slice(new);
        rows.extend(kept_end);
        rows.extend_from_slice(&now[now.len() - add..]);
        (rows, new.len() + add)
    }

    fn list(n: usize) -> Vec<String> {
        (0..n).map(|i| format!("row {i}")).collect()
    }

    /// Every kind of change a person makes gives the new list, and an insertion or deletion in a
    /// full window writes one or two rows, not the window.
    #[test]
    fn the_rows_follow_every_change_writing_few() {
        let all = list(300);
        let window = |l: &[String]| l.iter().take(100).cloned().collect::<Vec<_>>();
        let before = window(&all);
        for at in [0, 1, 50, 99, 150] {
            // A copy beside row `at`.
            let mut l = all.clone();
            l.insert(at + 1, "copy".into());
            let now = window(&l);
            let (rows, written) = apply(&before, &now);
            assert_eq!(rows, now, "insert at {at}");
            assert!(written <= 1, "insert at {at}: {written} rows written");
            // Row `at` deleted.
            let mut l = all.clone();
            l.remove(at);
            let now = window(&l);
            let (rows, written) = apply(&before, &now);
            assert_eq!(rows, now, "delete at {at}");
            assert!(written <= 1, "delete at {at}: {written} rows written");
        }
        // Every row changed (a unit switch), a shorter list, an empty one, from empty.
        let changed: Vec<String> = before.iter().map(|r| format!("{r} in US")).collect();
        for now in [changed, list(3), vec![], list(100)] {
            assert_eq!(apply(&before, &now).0, now);
            assert_eq!(apply(&now, &before).0, before);
        }
        assert_eq!(apply(&[], &list(2)).0, list(2));
    }
}
