// The cautions every result screen and the printed card carry. One wording, shared by UI, CLI
// and card so they never drift apart.
#pragma once

#include <array>
#include <string_view>

namespace firn::cautions {

// One short line for the foot of a result screen.
inline constexpr std::string_view short_line =
    "Decision support only. Clinical signs first. Descent is the definitive treatment. Follow "
    "local protocols and medical direction.";

// The full text behind "Read more" and on the card.
inline constexpr std::array<std::string_view, 5> full_text{
    "Firn is decision support only: it does not diagnose and does not replace clinical judgement.",
    "Treat the casualty, not the number: clinical signs and symptoms come first.",
    "Descent is the definitive treatment for serious altitude illness; oxygen and a hyperbaric "
    "bag buy time for it.",
    "Pulse oximeters are inaccurate below about 80 % SpO2, with cold fingers, poor perfusion or "
    "movement.",
    "Follow your local protocols and medical direction."};

}  // namespace firn::cautions
