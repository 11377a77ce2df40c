//! A wheel-size row of the chart: one designation per size written into the sizes' wheels,
//! front, rear or both as the label says.
//!
//! **Invariant:** a wheel is never used for a size it may not belong to: a row whose cells
//! single spaces joined is cut one per size only when it holds one wheel per size; else it is
//! left out with a note. A cell that is not a wheel size is left out with a note.

use super::label::WheelSlot;
use super::log::{shorten, Log};
use super::rows::TableRow;
use super::wheels::{default_note, parse_wheel_cell, rejoin, Rejoined};
use super::ChartSize;
use framewise_kernel::WheelSpec;

/// A wheel-size row: designations per size, with a note when a tyre width was assumed. A row
/// whose cells single spaces joined ([`rejoin`]) is cut one wheel per size, with a note, or,
/// when it holds another number of wheels, left out with a note: never one wheel for every
/// size when the row held several.
pub(super) fn read_wheels(sizes: &mut [ChartSize], row: &TableRow, slot: WheelSlot, log: &mut Log) {
    let (text, cells) = match rejoin(&row.label.text, &row.cells, sizes.len()) {
        Rejoined::Kept => {
            let (cells, lone) = one_or_each(&row.cells, sizes.len());
            if lone {
                log.note(
                    &row.label.text,
                    "one wheel size for every size; used it for all".into(),
                );
            }
            (row.label.text.clone(), cells)
        }
        Rejoined::Cut(name, cells) => {
            log.note(
                &name,
                "the wheel sizes were parted by single spaces; read one per size, from the left"
                    .into(),
            );
            (name, cells)
        }
        Rejoined::Unplaced(name, k) => {
            let n = sizes.len();
            log.note(
                &name,
                format!(
                    "{k} wheel sizes parted by single spaces for {n} sizes: which size each belongs to is not known, so none was used; set the wheels under Wheels and fork"
                ),
            );
            return;
        }
    };
    let text = &text;
    let mut assumed = false;
    for (size, cell) in sizes.iter_mut().zip(&cells) {
        if cell.trim().is_empty() {
            continue;
        }
        let Some(w) = parse_wheel_cell(cell) else {
            log.note(
                text,
                format!(
                    "{}: wheel size \"{}\" not recognised; left out",
                    size.label,
                    shorten(cell)
                ),
            );
            continue;
        };
        assumed |= w.width_assumed;
        if slot != WheelSlot::Rear {
            size.wheels.front = Some(WheelSpec::Designation(w.front));
        }
        if slot != WheelSlot::Front {
            size.wheels.rear = Some(WheelSpec::Designation(w.rear));
        }
    }
    if assumed {
        log.note(text, default_note());
    }
}

/// A wheel row's cells, one per size: a lone cell stands for every size (then `true`, and the
/// caller notes it, as other rows of one value get a note).
fn one_or_each(cells: &[String], n: usize) -> (Vec<String>, bool) {
    let given: Vec<&String> = cells.iter().filter(|c| !c.trim().is_empty()).collect();
    match given.as_slice() {
        [one] if n > 1 && cells.len() == 1 => (vec![(*one).clone(); n], true),
        _ => (cells.to_vec(), false),
    }
}
