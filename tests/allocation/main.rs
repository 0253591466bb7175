//! Allocation counts, in a test crate of their own with no test harness: dhat's profiler
//! replaces the global allocator and counts the blocks of every thread, so nothing may run
//! beside a check (the harness would start its threads and print while one counts).

mod plan_allocation;
mod select_allocation;

#[global_allocator]
static ALLOCATOR: dhat::Alloc = dhat::Alloc;

fn main() {
    let checks: [(&str, fn()); 2] = [
        (
            "plan_allocation::describing_a_planned_string_shares_its_words",
            plan_allocation::describing_a_planned_string_shares_its_words,
        ),
        (
            "select_allocation::selecting_strings_allocates_nothing",
            select_allocation::selecting_strings_allocates_nothing,
        ),
    ];
    for (name, check) in checks {
        check();
        println!("test {name} ... ok");
    }
    println!("allocation: {} passed, 0 failed", checks.len());
}
