//! The unit picker for one dimension.

use leptos::prelude::*;

use crate::engine::units::{self, Dim, UnitChoice};

/// The unit picker for one dimension; changing it changes that dimension everywhere on the page.
#[component]
pub fn UnitSelect(
    dim: Dim,
    choice: RwSignal<UnitChoice>,
    on_pick: impl Fn(String) + Copy + Send + Sync + 'static,
) -> impl IntoView {
    let options = units::units_of(dim)
        .map(|u| {
            view! {
                <option value=u.id prop:selected=move || choice.get().get(dim).id == u.id>
                    {u.symbol}
                </option>
            }
        })
        .collect_view();
    view! {
        <select
            class="unit-pick"
            aria-label="Unit"
            data-unit-for=format!("{dim:?}")
            on:change=move |ev| on_pick(event_target_value(&ev))
        >
            {options}
        </select>
    }
}
