// Screen "Team": the team profile in use (name, DEMO DATA when demo, cylinders, flows, bag, card
// range), loading the demo, importing and exporting the profile file, printing the pocket card,
// and handing the profile's cylinder and bag figures to the Oxygen and Bag screens.
#include "ui/panels.hpp"

#include <imgui.h>

#include <algorithm>
#include <string>

#include "model/cylinder.hpp"
#include "model/evacuation_plan.hpp"
#include "profile/pocket_card.hpp"
#include "ui/format.hpp"
#include "ui/team_store.hpp"
#include "ui/test_hook.hpp"
#include "ui/widgets.hpp"

namespace firn::ui {

namespace {

using namespace units;
namespace tp = team_profile;

// The profile is shown in its own unit system (as its card prints), not the app's settings.
struct ProfileUnits {
  const Unit<LengthDimension>& length;
  const Unit<PressureDimension>& gauge;
};
ProfileUnits units_of(const tp::TeamProfile& p) {
  bool us = p.units == tp::UnitSystem::Us;
  return {us ? feet : metres, us ? psi : bar};
}

// "3.3" → "3.3", "4.0" → "4": profile figures are usually round.
std::string trimmed_number(double value) {
  std::string text = shown_number(value, 2);
  if (text.find('.') != std::string::npos) {
    while (text.back() == '0') text.pop_back();
    if (text.back() == '.') text.pop_back();
  }
  return text;
}

Volume capacity_of(const tp::CylinderType& c) {
  if (c.water_capacity) return *c.water_capacity;
  return cylinder::letter_size_info(*c.letter_size).water_capacity;
}

// One "Label  value" line, recorded for the tests under `label`.
void profile_line(const char* label, const std::string& value) {
  ImGui::TextDisabled("%s", label);
  ImGui::SameLine();
  ImGui::PushTextWrapPos(0.0f);
  ImGui::TextUnformatted(value.c_str());
  ImGui::PopTextWrapPos();
  test_hook::item_text(label, value);
}

void draw_profile_summary(AppState& state, Platform& platform) {
  const tp::TeamProfile& p = state.team.profile;
  if (p.demo) {
    message_line("DEMO DATA: a fictional team in a fictional range. Import your team's "
                        "profile before relying on these figures.", true);
    test_hook::item_text("Demo", "DEMO DATA");
  }
  profile_line("Team name", p.team_name);
  const TeamState& team = state.team;
  profile_line("Kept", team.stored        ? "saved in " + platform.storage_location()
                       : team.backup_kept ? "built in; the unreadable saved profile is kept as " +
                                                std::string(kBadProfileKey)
                                          : std::string("built in (not saved yet)"));
}

void draw_profile_details(const AppState& state) {
  const tp::TeamProfile& p = state.team.profile;
  ProfileUnits u = units_of(p);
  profile_line("Model", p.atmosphere_model == atmosphere::Model::Isa ? "ISA" : "West 1996");

  heading("Cylinders");
  for (size_t i = 0; i < p.cylinders.size(); ++i) {
    const tp::CylinderType& c = p.cylinders[i];
    std::string line = c.label + ": " + trimmed_number(capacity_of(c).in(litres)) + " L" +
                       (c.water_capacity ? "" : " (size " +
                                                    std::string(cylinder::letter_size_info(*c.letter_size).name) + ")") +
                       ", full " + quantity_text(c.fill_pressure_gauge, u.gauge, 0) +
                       ", \xC3\x97" + std::to_string(c.count);
    bullet_line(line);
    test_hook::item_text("Cylinder " + std::to_string(i + 1), line);
  }
  profile_line("Reserve", quantity_text(p.reserve_pressure_gauge, u.gauge, 0));
  std::string flows;
  for (const VolumeFlow& f : p.flows) flows += (flows.empty() ? "" : ", ") + trimmed_number(f.in(litres_per_minute));
  profile_line("Flows", flows + " L/min");

  heading("Hyperbaric bag");
  profile_line("Bag gauge", quantity_text(p.bag.gauge_pressure, hectopascals, 0) + " (" +
                                quantity_text(p.bag.gauge_pressure, psi, 1) + ")");
  profile_line("Pump stroke", trimmed_number(p.bag.pump_stroke_volume.in(litres)) + " L");
  profile_line("CO2 limit", trimmed_number(p.bag.co2_limit.in(percent)) + " %");

  heading("Pocket card");
  profile_line("Card range", trimmed_number(p.card.altitude_from.in(u.length)) + "\xE2\x80\x93" +
                                 trimmed_number(p.card.altitude_to.in(u.length)) + " " +
                                 std::string(u.length.symbol) + " every " +
                                 trimmed_number(p.card.altitude_step.in(u.length)) + " " +
                                 std::string(u.length.symbol));
  for (const std::string& note : p.card.notes) bullet_line(note);
}

constexpr FileKind kProfileFile{"Import profile", "Export profile", "Profile file to import",
                                "team-profile-import.json", kExportFileName,
                                "use firn profile --check FILE."};

void draw_file_actions(AppState& state, Platform& platform) {
  heading("Profile file");
  if (big_button(state.display, "Load demo profile")) use_demo_profile(state, platform);
  if (std::optional<ImportedFile> file = import_control(state, platform, state.team.file, kProfileFile)) {
    import_team_profile(state, platform, file->text, file->name.empty() ? "the file" : file->name);
  }
  export_control(state, platform, state.team.file, kProfileFile, "profile",
                 [&] { return exported_profile_text(state); });
}

// Opens one printout (pocket card or reference sheet) in the platform's document viewer.
void open_printout(AppState& state, Platform& platform, pocket_card::Size size, const char* title,
                   const std::string& what) {
  TeamState& team = state.team;
  std::string html = pocket_card::render_html(pocket_card::build_card(team.profile, today_iso_date()), size);
  if (!platform.open_html_document(title, html)) {
    team.file.message = "The " + what + " could not be opened here; firn card --profile FILE --out " +
                   title + ".html --size " + std::string(pocket_card::size_key(size)) + " writes it.";
    team.file.message_is_problem = true;
    return;
  }
  std::string file = platform.document_location(title);
  team.file.message = file.empty() ? "The " + what + " opened in a new window: print it from there."
                              : "The " + what + " was written to " + file + " and opened.";
  team.file.message_is_problem = false;
}

void draw_card_actions(AppState& state, Platform& platform) {
  TeamState& team = state.team;
  const char* sizes[] = {"A6", "Wallet"};
  choice_row(state.display, "card-size", sizes, 2, &team.card_size);
  if (big_button(state.display, "Print pocket card")) {
    bool wallet = team.card_size == 1;
    open_printout(state, platform, wallet ? pocket_card::Size::Wallet : pocket_card::Size::A6,
                  "pocket-card",
                  wallet ? "wallet card (2 cards, both sides)" : "A6 card (one sheet, both sides)");
  }
  if (big_button(state.display, "Print team reference sheet (A4)")) {
    open_printout(state, platform, pocket_card::Size::Reference, "team-reference-sheet",
                  "team reference sheet");
  }
}

// The profile's usual carry-out, read by plan_input as `firn plan` reads it, becomes the Oxygen
// screen's plan: its time, a first timed flow, the flow until arrival and how many cylinders.
// The screen plans cylinders like the one in hand, so the profile's own gauges are not taken
// (they were read when the file was written). Returns what was taken, for the message.
std::string use_evacuation_section(const tp::TeamProfile& p, OxygenInputs& in) {
  Result<evacuation::PlanInput> made = tp::plan_input(p);
  if (!made || made->phases.empty() || made->cylinders.empty()) return "";
  const evacuation::PlanInput& plan = made.value();
  in.evacuation = plan.evacuation;
  in.evacuation_entered = true;  // the team's usual carry-out, chosen by the user
  in.count_entered = true;
  in.cylinder_count = std::clamp(static_cast<int>(plan.cylinders.size()), 1, OxygenInputs::kMaxCylinders);
  const evacuation::FlowPhase& first = plan.phases.front();
  bool timed_start = plan.phases.size() > 1 && first.duration.has_value();
  in.first_flow = first.flow;
  in.first_flow_entered = timed_start;
  in.first_phase = timed_start ? *first.duration : minutes(0.0);
  in.flow = plan.phases.back().flow;
  std::string taken = "plan " + duration_text(in.evacuation) + ", " + std::to_string(in.cylinder_count) +
                      " cylinders, " + (timed_start ? flow_text(in.first_flow) + " for " +
                                                          duration_text(in.first_phase) + " then "
                                                    : std::string()) +
                      flow_text(in.flow);
  if (plan.phases.size() > 2) taken += " (the middle flows are planned on the Route screen)";
  return taken;
}

// The first cylinder kind, the reserve, the first flow, the usual carry-out and the bag gauge
// become the inputs of the Oxygen and Bag screens; the user can still change them there.
void draw_use_in_calculators(AppState& state) {
  const tp::TeamProfile& p = state.team.profile;
  if (!big_button(state.display, "Use on Oxygen and Bag screens")) return;
  const tp::CylinderType& c = p.cylinders.front();
  OxygenInputs& in = state.oxygen;
  in.water_capacity = capacity_of(c);
  in.gauge = c.fill_pressure_gauge;
  in.gauge_entered = true;  // chosen by the user ("full"), though not a reading:
  in.gauge_read_at = 0;     // the Record screen times no reserve from it
  in.reserve = p.reserve_pressure_gauge;
  in.flow = p.flows.front();
  in.flow_entered = true;
  std::string plan = use_evacuation_section(p, in);
  state.bag.gauge = p.bag.gauge_pressure;
  state.team.file.message = "Oxygen screen: " + c.label + " full, reserve and flow from the profile" +
                            (plan.empty() ? "" : "; " + plan) + "; Bag screen: the profile's gauge pressure.";
  state.team.file.message_is_problem = false;
}

}  // namespace

// Name and demo marker first, the actions next (a thumb reaches them), their outcome right
// below them, then the profile's figures.
void draw_team_panel(AppState& state, Platform& platform) {
  draw_profile_summary(state, platform);
  draw_card_actions(state, platform);
  draw_file_actions(state, platform);
  if (!state.team.file.message.empty()) {
    message_line(state.team.file.message, state.team.file.message_is_problem);
    test_hook::item_text("Team message", state.team.file.message);
  }
  draw_profile_details(state);
  draw_use_in_calculators(state);
  caution_line(state);
}

}  // namespace firn::ui
